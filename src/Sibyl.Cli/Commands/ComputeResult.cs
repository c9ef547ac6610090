using Sibyl.Cli.Output;
using Sibyl.Plotting;

namespace Sibyl.Cli.Commands;

/// <summary>What a <c>compute</c> output produces: the CSV, a one-line summary for stderr, and its figure.</summary>
internal sealed record ComputeResult(CsvTable Table, string Summary, SpectrumFigure Figure);
