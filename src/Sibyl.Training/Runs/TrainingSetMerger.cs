using System.Globalization;
using Sibyl.Training.Design;
using Sibyl.Training.Storage;

namespace Sibyl.Training.Runs;

/// <summary>
/// Joins the chunks of one or more run folders (shards on a shared file system, or folders copied together) into
/// one training set. It refuses, listing every problem: damaged chunk files, chunks of another design, chunks
/// from different builds, a chunk present twice with different contents, and missing chunks, which it names
/// with their points and the shard to resubmit.
/// </summary>
public static class TrainingSetMerger
{
    /// <summary>Merges the chunks found in <paramref name="folders"/>.</summary>
    /// <exception cref="MergeException">Something is missing or inconsistent; every problem is listed.</exception>
    public static TrainingSet Merge(TrainingDesign design, IReadOnlyList<string> folders)
    {
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(folders);
        var problems = new List<string>();
        int perPoint = TrainingOutput.ValuesPerPoint(design.Spec);
        var found = new Dictionary<int, (ChunkContract Chunk, string Path)>();
        foreach (string folder in folders)
        {
            if (!Directory.Exists(folder))
            {
                problems.Add($"{folder}: no such run folder");
                continue;
            }

            foreach (string path in Directory.EnumerateFiles(folder, ChunkFile.Pattern).Order(StringComparer.Ordinal))
            {
                ChunkContract chunk;
                try
                {
                    chunk = ChunkFile.Read(path, design, perPoint);
                }
                catch (CorruptFileException e)
                {
                    problems.Add($"{e.Message} (delete it and rerun its shard)");
                    continue;
                }

                if (found.TryGetValue(chunk.Chunk, out var earlier))
                {
                    if (!SameResults(earlier.Chunk, chunk))
                    {
                        problems.Add($"chunk {chunk.Chunk} differs between {earlier.Path} and {path}; keep one of them");
                    }

                    continue;
                }

                found[chunk.Chunk] = (chunk, path);
            }
        }

        var builds = found.Values.GroupBy(c => c.Chunk.CodeFingerprint).ToList();
        if (builds.Count > 1)
        {
            problems.Add("the chunks come from different builds of Sibyl: " + string.Join("; ", builds.Select(b =>
                $"{b.Key} ({b.Count()} chunks, e.g. {b.First().Path})")) + "; recompute with one build");
        }

        ReportMissing(design, found, folders, problems);
        if (problems.Count > 0)
        {
            throw new MergeException(problems);
        }

        var values = new double[]?[design.Count];
        var errors = new string?[design.Count];
        foreach (var (chunk, _) in found.Values)
        {
            int start = design.ChunkRange(chunk.Chunk).Start;
            chunk.Values.CopyTo(values, start);
            chunk.Errors.CopyTo(errors, start);
        }

        return TrainingSet.Create(design, builds[0].Key, TrainingOutput.Layout(design.Spec), values, errors);
    }

    private static void ReportMissing(TrainingDesign design, Dictionary<int, (ChunkContract Chunk, string Path)> found, IReadOnlyList<string> folders, List<string> problems)
    {
        var missing = Enumerable.Range(0, design.ChunkCount).Where(c => !found.ContainsKey(c)).ToList();
        if (missing.Count == 0)
        {
            return;
        }

        if (found.Count == 0)
        {
            problems.Add($"no chunks of this design in {string.Join(", ", folders)}; run `sibyl run` first");
            return;
        }

        int points = missing.Sum(c => design.ChunkRange(c).End - design.ChunkRange(c).Start);
        string list = string.Join(", ", missing.Take(20).Select(c =>
        {
            var (start, end) = design.ChunkRange(c);
            return string.Create(CultureInfo.InvariantCulture, $"{c} (points {start}-{end - 1})");
        })) + (missing.Count > 20 ? $", and {missing.Count - 20} more" : "");
        problems.Add($"{missing.Count} of {design.ChunkCount} chunks ({points} points) are missing: {list}");

        var shardCounts = found.Values.Select(c => c.Chunk.ShardCount).Distinct().ToList();
        if (shardCounts.Count == 1)
        {
            int n = shardCounts[0];
            var shards = missing.Select(c => ShardSelection.OwnerOf(c, n)).Distinct().Order();
            problems.Add($"they belong to shard{(shards.Count() == 1 ? "" : "s")} {string.Join(", ", shards.Select(s => $"{s}/{n}"))}: rerun just those (`sibyl run DESIGN --shard I/{n}`)");
        }
        else
        {
            problems.Add("rerun `sibyl run DESIGN` (without --shard, or with the shards you used) to compute just the missing chunks");
        }
    }

    private static bool SameResults(ChunkContract a, ChunkContract b)
    {
        if (a.CodeFingerprint != b.CodeFingerprint || a.Values.Length != b.Values.Length)
        {
            return false;
        }

        for (int i = 0; i < a.Values.Length; i++)
        {
            if (a.Errors[i] != b.Errors[i])
            {
                return false;
            }

            if (a.Values[i] is { } x && b.Values[i] is { } y && !x.AsSpan().SequenceEqual(y))
            {
                return false;
            }
        }

        return true;
    }
}
