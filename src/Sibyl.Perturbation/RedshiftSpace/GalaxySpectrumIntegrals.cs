using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>Every momentum integral the galaxy loop needs of one spectrum.</summary>
/// <param name="Matter">The six P_13 and three real-space P_22 integrals.</param>
/// <param name="P22">Redshift-space pair integrals.</param>
/// <param name="Displacement">I_Dα, I_Dγ, structure-major over k.</param>
/// <param name="SigmaV2">σ_v² in (Mpc/h)².</param>
/// <param name="ConstantB2B2">(1/π²)∫dq q² P², the k → 0 limit of the b2² integral, (Mpc/h)³.</param>
internal sealed record GalaxySpectrumIntegrals(MomentumIntegrals Matter, RedshiftP22Integrals P22, double[] Displacement, double SigmaV2, double ConstantB2B2);
