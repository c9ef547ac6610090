namespace Sibyl.Perturbation.Spectra;

/// <summary>
/// One term of an observable: a function of k that enters multiplied by
/// <see cref="Prefactor"/> × Π (nuisance parameters at <see cref="NuisanceFactors"/>).
/// </summary>
/// <param name="Name">Column name, for example <c>P_ct_basis</c>.</param>
/// <param name="Observable">Index of the observable it belongs to (P, or P0/P2/P4).</param>
/// <param name="Prefactor">Fixed number in front, for example −2 for the k²P counterterm.</param>
/// <param name="NuisanceFactors">Indices of the nuisance parameters multiplied together (repeat for squares; empty for 1).</param>
public sealed record BasisTerm(string Name, int Observable, double Prefactor, IReadOnlyList<int> NuisanceFactors);
