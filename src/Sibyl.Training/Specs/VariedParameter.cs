namespace Sibyl.Training.Specs;

/// <summary>A parameter spanned by the design, uniformly in [<paramref name="Min"/>, <paramref name="Max"/>].</summary>
/// <param name="Name">Catalog name (for example <c>omega_cdm</c>) or <c>z</c>.</param>
/// <param name="Min">Lower edge of the prior box.</param>
/// <param name="Max">Upper edge, above <paramref name="Min"/>.</param>
public sealed record VariedParameter(string Name, double Min, double Max)
{
    /// <summary>Maps a unit-cube coordinate u ∈ [0, 1] to the box.</summary>
    public double FromUnit(double u) => Min + (u * (Max - Min));
}
