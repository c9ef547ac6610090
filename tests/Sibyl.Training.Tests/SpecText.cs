using System.Text.Json.Nodes;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests;

/// <summary>
/// A small valid matter spec (two varied parameters, one redshift, 12 k values in [0.01, 0.3] h/Mpc) and edits
/// of it, so that each test states only what it changes.
/// </summary>
internal static class SpecText
{
    public const string Base = """
        {
          "name": "test-grid",
          "output": "matter",
          "model": "lcdm",
          "vary": { "omega_cdm": [0.11, 0.13], "h": [0.65, 0.70] },
          "fixed": { "omega_b": 0.0224 },
          "redshifts": [0.5],
          "k": { "min": 0.01, "max": 0.3, "count": 12 },
          "points": { "training": 6, "heldout": 2 },
          "seed": 7,
          "chunk_size": 2
        }
        """;

    /// <summary>
    /// <see cref="Base"/> with edits "a.b=JSON" (sets field b of object a, creating nothing but the last level)
    /// or "a.b=" (removes it).
    /// </summary>
    public static string With(params string[] edits)
    {
        var root = JsonNode.Parse(Base)!.AsObject();
        foreach (string edit in edits)
        {
            int equals = edit.IndexOf('=', StringComparison.Ordinal);
            string[] path = edit[..equals].Split('.');
            string value = edit[(equals + 1)..];
            var parent = root;
            foreach (string step in path[..^1])
            {
                parent = parent[step]!.AsObject();
            }

            if (value.Length == 0)
            {
                parent.Remove(path[^1]);
            }
            else
            {
                parent[path[^1]] = JsonNode.Parse(value);
            }
        }

        return root.ToJsonString();
    }

    public static GridSpec Spec(params string[] edits) => GridSpecReader.Parse(With(edits), "test spec");
}
