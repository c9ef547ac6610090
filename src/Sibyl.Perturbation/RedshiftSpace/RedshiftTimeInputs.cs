using Sibyl.Perturbation.Kernels;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The time-dependent numbers the galaxy loop needs, normalised to the linear density at the output time:
/// f, b̃ = B/D², ṽ = B'/D², x_s = X_s/D³, y_s = Y_s/D³. <see cref="MappingScale"/> multiplies every velocity
/// in the redshift-space mapping (1 for redshift space, 0 for real space); Γ3 keeps the physical velocity.
/// </summary>
public sealed class RedshiftTimeInputs
{
    /// <summary>Normalises <paramref name="coefficients"/>.</summary>
    /// <param name="coefficients">Time coefficients at the output redshift.</param>
    /// <param name="mappingScale">1 for redshift space, 0 for real space.</param>
    public RedshiftTimeInputs(TimeCoefficients coefficients, double mappingScale = 1.0)
    {
        ArgumentNullException.ThrowIfNull(coefficients);
        var kernels = new MatterKernels(coefficients);
        double d3 = coefficients.D * coefficients.D * coefficients.D;
        GrowthRate = coefficients.F;
        MappingScale = mappingScale;
        DensityGamma = kernels.SecondDensityGamma;
        VelocityGamma = kernels.SecondVelocityGamma;
        Density = Enum.GetValues<ThirdOrderStructure>().Select(s => coefficients.Density(s) / d3).ToArray();
        Velocity = Enum.GetValues<ThirdOrderStructure>().Select(s => coefficients.Velocity(s) / d3).ToArray();
    }

    /// <summary>Physical growth rate f.</summary>
    public double GrowthRate { get; }

    /// <summary>1 in redshift space, 0 in real space.</summary>
    public double MappingScale { get; }

    /// <summary>f as it enters the mapping.</summary>
    public double MappedGrowthRate => MappingScale * GrowthRate;

    /// <summary>b̃ = B/D².</summary>
    public double DensityGamma { get; }

    /// <summary>ṽ = B'/D² (physical).</summary>
    public double VelocityGamma { get; }

    /// <summary>ṽ as it enters the mapping.</summary>
    public double MappedVelocityGamma => MappingScale * VelocityGamma;

    /// <summary>x_s = X_s/D³ indexed by <see cref="ThirdOrderStructure"/>.</summary>
    public IReadOnlyList<double> Density { get; }

    /// <summary>y_s = Y_s/D³ indexed by <see cref="ThirdOrderStructure"/> (physical).</summary>
    public IReadOnlyList<double> Velocity { get; }

    /// <summary>b̃ − ṽ/f, the γ coefficient of F2 − G2 that Γ3 sees.</summary>
    public double TidalDifference => DensityGamma - VelocityGamma / GrowthRate;
}
