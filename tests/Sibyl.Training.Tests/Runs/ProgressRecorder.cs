using Sibyl.Training.Runs;

namespace Sibyl.Training.Tests.Runs;

/// <summary>Records progress synchronously (<see cref="Progress{T}"/> would post reports to the thread pool).</summary>
internal sealed class ProgressRecorder(List<RunProgress> reports) : IProgress<RunProgress>
{
    public void Report(RunProgress value)
    {
        lock (reports)
        {
            reports.Add(value);
        }
    }
}
