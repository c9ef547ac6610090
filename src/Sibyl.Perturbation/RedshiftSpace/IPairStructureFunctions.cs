namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// A set of structure functions S_s(k, q, p) of a P_22-type momentum integral
/// J_s(k) = 2∫d³q/(2π)³ S_s(k, q, |k − q|) P(q) P(|k − q|), for <see cref="BandedProductTable"/>.
/// </summary>
/// <remarks>
/// Each function must be symmetric under q ↔ p, because the table integrates only the half p ≥ q and doubles it.
/// The table applies the measure; implementations return S itself, finite on |k − q| ≤ p ≤ k + q
/// (the integrable 1/p² of redshift-space structures is cancelled by the measure's q²p²).
/// </remarks>
internal interface IPairStructureFunctions
{
    /// <summary>Number of functions written by <see cref="Evaluate"/>.</summary>
    int Count { get; }

    /// <summary>Writes S_s(k, q, p), s = 0..Count − 1; k, q, p in h/Mpc with |k − q| ≤ p ≤ k + q up to rounding.</summary>
    void Evaluate(double k, double q, double p, Span<double> values);
}
