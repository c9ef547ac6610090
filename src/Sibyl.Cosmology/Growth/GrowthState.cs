namespace Sibyl.Cosmology.Growth;

/// <summary>Linear growth at one scale factor.</summary>
/// <param name="ScaleFactor">a = 1/(1+z).</param>
/// <param name="D">Growth factor D(a), normalised so that D → a deep in matter domination.</param>
/// <param name="F">Growth rate f = d ln D / d ln a.</param>
public readonly record struct GrowthState(double ScaleFactor, double D, double F);
