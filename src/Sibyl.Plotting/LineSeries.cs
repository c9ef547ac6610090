namespace Sibyl.Plotting;

/// <summary>One named curve of a panel, copied at the moment it was added so callers may reuse their buffers.</summary>
internal sealed record LineSeries(string Name, double[] X, double[] Y);
