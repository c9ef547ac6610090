using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Training.Specs;

/// <summary>
/// The canonical JSON of a spec (fixed field order, fixed values sorted by name, round-trip numbers, explicit
/// k values): stored inside every design and training set, and hashed to identify the spec independently of
/// how its file was formatted.
/// </summary>
public static class GridSpecJson
{
    /// <summary>Canonical JSON text; <see cref="GridSpecReader.Parse"/> reads it back to an equal spec.</summary>
    public static string Write(GridSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        using var buffer = new MemoryStream();
        using (var json = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = true }))
        {
            json.WriteStartObject();
            json.WriteString("name", spec.Name);
            json.WriteString("output", spec.Output == OutputKind.Matter ? "matter" : "galaxy");
            json.WriteString("model", spec.Model);
            json.WriteStartObject("vary");
            foreach (var v in spec.Varied)
            {
                json.WriteStartArray(v.Name);
                json.WriteNumberValue(v.Min);
                json.WriteNumberValue(v.Max);
                json.WriteEndArray();
            }

            json.WriteEndObject();
            json.WriteStartObject("fixed");
            foreach (var (name, value) in spec.Fixed.OrderBy(p => p.Key, StringComparer.Ordinal))
            {
                json.WriteNumber(name, value);
            }

            json.WriteEndObject();
            if (spec.Redshifts.Count > 0)
            {
                WriteArray(json, "redshifts", spec.Redshifts);
            }

            json.WriteStartObject("k");
            WriteArray(json, "values", spec.K);
            json.WriteEndObject();
            json.WriteStartObject("points");
            json.WriteNumber("training", spec.TrainingPoints);
            json.WriteNumber("heldout", spec.HeldOutPoints);
            json.WriteEndObject();
            json.WriteNumber("seed", spec.Seed);
            json.WriteNumber("chunk_size", spec.ChunkSize);
            if (spec.Linear is { } linear)
            {
                json.WriteStartObject("linear");
                json.WriteStartArray("command");
                foreach (var part in linear.Command)
                {
                    json.WriteStringValue(part);
                }

                json.WriteEndArray();
                json.WriteNumber("timeout_seconds", linear.TimeoutSeconds);
                json.WriteNumber("k_min", linear.KMin);
                json.WriteNumber("k_max", linear.KMax);
                json.WriteEndObject();
            }
            else if (spec.LinearSource != LinearSource.Fit)
            {
                // The fit stays implicit, so specs written before the solver existed keep their hash.
                json.WriteString("linear", ParameterCatalog.NameOf(spec.LinearSource));
            }

            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray());
    }

    /// <summary>SHA-256 of the canonical JSON, lower-case hex.</summary>
    public static string Hash(GridSpec spec) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(Write(spec))));

    private static void WriteArray(Utf8JsonWriter json, string name, IReadOnlyList<double> values)
    {
        json.WriteStartArray(name);
        foreach (double value in values)
        {
            json.WriteNumberValue(value);
        }

        json.WriteEndArray();
    }
}
