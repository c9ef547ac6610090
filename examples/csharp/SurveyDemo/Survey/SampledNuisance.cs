namespace Sibyl.Demo.Survey;

/// <summary>A nuisance parameter the sampler explores under a flat prior on [min, max].</summary>
/// <param name="Name">Name in the galaxy basis (for example b1).</param>
/// <param name="Min">Lower edge of the flat prior.</param>
/// <param name="Max">Upper edge of the flat prior.</param>
/// <param name="Start">Centre of the walkers' starting ball.</param>
public sealed record SampledNuisance(string Name, double Min, double Max, double Start);
