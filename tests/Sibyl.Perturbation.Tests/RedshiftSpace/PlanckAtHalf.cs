using Sibyl.Cosmology;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>The default (Planck-like, fitting-formula) cosmology at z = 0.5 that the redshift-space referees use.</summary>
internal static class PlanckAtHalf
{
    public static CosmologyModel Model { get; } = CosmologyModel.Create(new CosmologyParameters());

    public static TimeCoefficients Time { get; } = TimeCoefficientSolver.Solve(Model.Background, Model.Gravity, 1.0 / 1.5);

    /// <summary>P_L(k, z = 0.5) on the linear table.</summary>
    public static LogSampledSpectrum Spectrum { get; } = new(
        Model.Linear.Shape.Values.ToArray().Select(p => p * Time.D * Time.D).ToArray(), Model.Linear.Shape.KMin, Model.Linear.Shape.KMax);
}
