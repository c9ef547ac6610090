namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>Ionisation of the gas per hydrogen nucleus: n_HII/n_H, n_HeII/n_H and n_HeIII/n_H.</summary>
internal readonly record struct IonizationState(double Hydrogen, double HeliumII, double HeliumIII)
{
    /// <summary>Free electrons per hydrogen nucleus, x_e = n_e / n_H.</summary>
    public double FreeElectrons => Hydrogen + HeliumII + 2.0 * HeliumIII;
}
