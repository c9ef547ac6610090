namespace Sibyl.Training.Tests;

/// <summary>A fresh folder under the system's temporary folder, deleted with everything in it on dispose.</summary>
public sealed class TemporaryFolder : IDisposable
{
    public TemporaryFolder() => Path = Directory.CreateTempSubdirectory("sibyl-training-").FullName;

    public string Path { get; }

    /// <summary>A path inside the folder (nothing is created).</summary>
    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Creates and returns a subfolder.</summary>
    public string Folder(string name) => Directory.CreateDirectory(File(name)).FullName;

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
