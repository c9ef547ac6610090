using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests.Runs;

/// <summary>
/// One complete, unsharded run of a 10 + 2 point matter design in chunks of 2 (6 chunks), computed once for
/// every test of the <see cref="ReferenceRunCollection"/>; tests copy its folder and compare against its merge.
/// </summary>
public sealed class ReferenceRun : IDisposable
{
    private readonly TemporaryFolder _root = new();

    public ReferenceRun()
    {
        Spec = SpecText.Spec("points={\"training\": 10, \"heldout\": 2}");
        Design = TrainingDesign.Create(Spec);
        Folder = _root.Folder("reference.run");
        Summary = new TrainingRun(Design, Folder, ShardSelection.All, threads: 2, retryFailed: false).Execute(null, null, CancellationToken.None);
        Merged = TrainingSetMerger.Merge(Design, [Folder]).ToBytes();
    }

    public GridSpec Spec { get; }

    public TrainingDesign Design { get; }

    /// <summary>The run folder; tests must not change it (copy it with <see cref="CopyTo"/>).</summary>
    public string Folder { get; }

    public RunSummary Summary { get; }

    /// <summary>The bytes of the merged training set.</summary>
    public byte[] Merged { get; }

    /// <summary>Copies every chunk file into a new folder <paramref name="name"/> of <paramref name="folder"/>.</summary>
    public string CopyTo(TemporaryFolder folder, string name)
    {
        string target = folder.Folder(name);
        foreach (string file in Directory.EnumerateFiles(Folder))
        {
            File.Copy(file, Path.Combine(target, Path.GetFileName(file)));
        }

        return target;
    }

    public void Dispose() => _root.Dispose();
}
