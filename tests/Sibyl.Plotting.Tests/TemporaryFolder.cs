namespace Sibyl.Plotting.Tests;

/// <summary>A fresh folder per test, removed afterwards, so tests neither share files nor leave them behind.</summary>
internal sealed class TemporaryFolder : IDisposable
{
    public TemporaryFolder()
    {
        Path = Directory.CreateTempSubdirectory("sibyl-plot-").FullName;
    }

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
