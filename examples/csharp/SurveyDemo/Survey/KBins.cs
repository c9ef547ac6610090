namespace Sibyl.Demo.Survey;

/// <summary>Linear k bins [min, max] of equal width, h/Mpc.</summary>
/// <param name="Min">Lower edge of the first bin.</param>
/// <param name="Max">Upper edge of the last bin.</param>
/// <param name="Width">Bin width Δk.</param>
public sealed record KBins(double Min, double Max, double Width);
