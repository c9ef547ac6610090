using System.Globalization;
using Sibyl.Training.Runs;

namespace Sibyl.Cli.Output;

/// <summary>
/// Shows a run's progress on stderr: one line rewritten in place on a terminal, or, when stderr goes to a file
/// (a batch scheduler's log), a new line every <see cref="LogInterval"/> so that logs stay short but show life.
/// </summary>
internal sealed class ProgressDisplay(TextWriter stderr, bool interactive) : IProgress<RunProgress>
{
    private static readonly TimeSpan LogInterval = TimeSpan.FromSeconds(10);
    private static readonly TimeSpan RedrawInterval = TimeSpan.FromMilliseconds(250);

    private readonly Lock _gate = new();
    private TimeSpan? _lastShown;
    private bool _lineOpen;

    public void Report(RunProgress value)
    {
        lock (_gate)
        {
            if (value.Total == 0)
            {
                return;
            }

            bool finished = value.Done == value.Total;
            if (!finished && _lastShown is { } last && value.Elapsed - last < (interactive ? RedrawInterval : LogInterval))
            {
                return;
            }

            _lastShown = value.Elapsed;
            string line = Describe(value);
            if (interactive)
            {
                stderr.Write($"\r{line,-90}");
                _lineOpen = !finished;
                if (finished)
                {
                    stderr.WriteLine();
                }
            }
            else
            {
                stderr.WriteLine(line);
            }
        }
    }

    /// <summary>Ends an open in-place line so that later messages start on their own line.</summary>
    public void Close()
    {
        lock (_gate)
        {
            if (_lineOpen)
            {
                stderr.WriteLine();
                _lineOpen = false;
            }
        }
    }

    public static string Describe(RunProgress p)
    {
        double percent = p.Total == 0 ? 100.0 : 100.0 * p.Done / p.Total;
        string left = p.Remaining is { } r ? Duration(r) : "?";
        string failed = p.Failed > 0 ? string.Create(CultureInfo.InvariantCulture, $", {p.Failed} failed") : "";
        return string.Create(
            CultureInfo.InvariantCulture,
            $"run: {p.Done}/{p.Total} points ({percent:F1}%){failed}, {p.Rate:G3} points/s, elapsed {Duration(p.Elapsed)}, left {left}");
    }

    public static string Duration(TimeSpan t) => t.TotalHours >= 1
        ? string.Create(CultureInfo.InvariantCulture, $"{(int)t.TotalHours}h{t.Minutes:D2}m")
        : string.Create(CultureInfo.InvariantCulture, $"{t.Minutes}m{t.Seconds:D2}s");
}
