using Sibyl.Training.Runs;

namespace Sibyl.Training.Tests.Runs;

/// <summary>
/// Records progress synchronously (<see cref="Progress{T}"/> would post reports to the thread pool), then hands
/// each report to <paramref name="then"/>.
/// </summary>
internal sealed class ProgressRecorder(List<RunProgress> reports, Action<RunProgress>? then = null) : IProgress<RunProgress>
{
    public void Report(RunProgress value)
    {
        lock (reports)
        {
            reports.Add(value);
        }

        then?.Invoke(value);
    }
}
