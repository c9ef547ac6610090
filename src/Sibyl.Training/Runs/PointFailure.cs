namespace Sibyl.Training.Runs;

/// <summary>A design point whose calculation failed.</summary>
/// <param name="Index">Point index in the design.</param>
/// <param name="Parameters">Its varied-parameter values, in spec order.</param>
/// <param name="Error">What went wrong.</param>
public sealed record PointFailure(int Index, IReadOnlyList<double> Parameters, string Error);
