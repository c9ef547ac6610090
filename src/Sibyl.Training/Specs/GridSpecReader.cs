using System.Globalization;
using System.Text.Json;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Training.Specs;

/// <summary>
/// Reads a grid spec from JSON (format in training-grids/README.md) and checks it completely, so that a run
/// never starts on a spec that would fail half-way: every problem found is reported, one line each, naming
/// the field and what is allowed.
/// </summary>
public static class GridSpecReader
{
    /// <summary>Largest number of varied parameters (every corner of the box is checked: 2^16 cosmologies).</summary>
    public const int MaxVaried = 16;

    /// <summary>Largest training or held-out count.</summary>
    public const int MaxPoints = 1_000_000;

    /// <summary>Default points per chunk file.</summary>
    public const int DefaultChunkSize = 4;

    private static readonly string[] TopLevel = ["name", "description", "output", "model", "vary", "fixed", "redshifts", "k", "points", "seed", "chunk_size", "linear"];

    /// <summary>Reads and checks the spec file at <paramref name="path"/>.</summary>
    /// <exception cref="GridSpecException">The spec is invalid; every problem is listed.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static GridSpec ReadFile(string path) => Parse(File.ReadAllText(path), path);

    /// <summary>Parses and checks spec text; <paramref name="source"/> names it in messages.</summary>
    /// <exception cref="GridSpecException">The spec is invalid; every problem is listed.</exception>
    public static GridSpec Parse(string json, string source)
    {
        ArgumentNullException.ThrowIfNull(json);
        JsonDocument document;
        try
        {
            // A name given twice is refused: silently taking one of the values would draw a design the user did not ask for.
            document = JsonDocument.Parse(json, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true, AllowDuplicateProperties = false });
        }
        catch (JsonException e)
        {
            throw new GridSpecException(source, [$"not valid JSON: {e.Message}"]);
        }

        using (document)
        {
            var problems = new List<string>();
            var spec = Read(document.RootElement, problems);
            if (spec is not null)
            {
                GridSpecValidator.Check(spec, problems);
            }

            if (problems.Count > 0)
            {
                throw new GridSpecException(source, problems);
            }

            return spec!;
        }
    }

    private static GridSpec? Read(JsonElement root, List<string> problems)
    {
        if (root.ValueKind != JsonValueKind.Object)
        {
            problems.Add("the spec must be one JSON object");
            return null;
        }

        foreach (var property in root.EnumerateObject())
        {
            if (!TopLevel.Contains(property.Name, StringComparer.Ordinal))
            {
                problems.Add($"{property.Name}: unknown field; allowed: {string.Join(", ", TopLevel)}");
            }
        }

        string name = String(root, "name", problems) ?? "";
        string? outputText = String(root, "output", problems);
        var output = outputText switch
        {
            "matter" => OutputKind.Matter,
            "galaxy" => OutputKind.Galaxy,
            _ => (OutputKind?)null,
        };
        if (output is null && outputText is not null)
        {
            problems.Add($"output: must be \"matter\" or \"galaxy\", got \"{outputText}\"");
        }

        string model = root.TryGetProperty("model", out var modelElement) ? StringValue(modelElement, "model", problems) ?? "" : "lcdm";
        var varied = ReadVaried(root, problems);
        var fixedValues = ReadFixed(root, problems);
        var redshifts = root.TryGetProperty("redshifts", out var zElement) ? NumberArray(zElement, "redshifts", problems) : [];
        var k = ReadK(root, problems);
        var (training, heldOut) = ReadPoints(root, problems);
        ulong seed = 0;
        if (!root.TryGetProperty("seed", out var seedElement))
        {
            problems.Add("seed: missing; give a non-negative integer so the design can be reproduced");
        }
        else if (seedElement.ValueKind != JsonValueKind.Number || !seedElement.TryGetUInt64(out seed))
        {
            problems.Add($"seed: must be an integer in [0, {ulong.MaxValue}], got {seedElement.GetRawText()}");
        }

        int chunkSize = root.TryGetProperty("chunk_size", out var chunkElement) ? Integer(chunkElement, "chunk_size", 1, 100_000, problems) : DefaultChunkSize;
        var (linear, source) = root.TryGetProperty("linear", out var linearElement) ? ReadLinear(linearElement, problems) : (null, LinearSource.Fit);

        return new GridSpec
        {
            Name = name,
            Output = output ?? OutputKind.Matter,
            Model = model,
            Varied = varied,
            Fixed = fixedValues,
            Redshifts = redshifts,
            K = k,
            TrainingPoints = training,
            HeldOutPoints = heldOut,
            Seed = seed,
            ChunkSize = chunkSize,
            Linear = linear,
            LinearSource = source,
        };
    }

    private static List<VariedParameter> ReadVaried(JsonElement root, List<string> problems)
    {
        var varied = new List<VariedParameter>();
        if (!root.TryGetProperty("vary", out var element) || element.ValueKind != JsonValueKind.Object)
        {
            problems.Add("vary: missing; give an object of name: [min, max] for each parameter the design spans");
            return varied;
        }

        foreach (var property in element.EnumerateObject())
        {
            string field = $"vary.{property.Name}";
            var range = NumberArray(property.Value, field, problems);
            if (range.Length != 2)
            {
                if (property.Value.ValueKind == JsonValueKind.Array)
                {
                    problems.Add($"{field}: must be [min, max], two numbers; got {range.Length}");
                }

                continue;
            }

            varied.Add(new VariedParameter(property.Name, range[0], range[1]));
        }

        return varied;
    }

    private static Dictionary<string, double> ReadFixed(JsonElement root, List<string> problems)
    {
        var values = new Dictionary<string, double>(StringComparer.Ordinal);
        if (!root.TryGetProperty("fixed", out var element))
        {
            return values;
        }

        if (element.ValueKind != JsonValueKind.Object)
        {
            problems.Add("fixed: must be an object of name: value");
            return values;
        }

        foreach (var property in element.EnumerateObject())
        {
            if (Number(property.Value, $"fixed.{property.Name}", problems) is { } value)
            {
                values[property.Name] = value;
            }
        }

        return values;
    }

    private static double[] ReadK(JsonElement root, List<string> problems)
    {
        if (!root.TryGetProperty("k", out var element) || element.ValueKind != JsonValueKind.Object)
        {
            problems.Add("k: missing; give {\"min\": ..., \"max\": ..., \"count\": ...} (log-spaced, h/Mpc) or {\"values\": [...]}");
            return [];
        }

        if (element.TryGetProperty("values", out var values))
        {
            if (element.EnumerateObject().Count() > 1)
            {
                problems.Add("k: give either values or min/max/count, not both");
            }

            return NumberArray(values, "k.values", problems);
        }

        double? min = Required(element, "min", "k.min", problems);
        double? max = Required(element, "max", "k.max", problems);
        int count = element.TryGetProperty("count", out var countElement) ? Integer(countElement, "k.count", 2, 10_000, problems) : 0;
        if (!element.TryGetProperty("count", out _))
        {
            problems.Add("k.count: missing; number of log-spaced values in [2, 10000]");
        }

        if (min is not { } lo || max is not { } hi || count < 2)
        {
            return [];
        }

        if (!(lo > 0.0 && hi > lo))
        {
            problems.Add(string.Create(CultureInfo.InvariantCulture, $"k: need 0 < min < max, got min = {lo:G}, max = {hi:G}"));
            return [];
        }

        return LogGridFunction.LogGrid(lo, hi, count);
    }

    private static (int Training, int HeldOut) ReadPoints(JsonElement root, List<string> problems)
    {
        if (!root.TryGetProperty("points", out var element) || element.ValueKind != JsonValueKind.Object)
        {
            problems.Add("points: missing; give {\"training\": n, \"heldout\": m}");
            return (0, 0);
        }

        foreach (var property in element.EnumerateObject())
        {
            if (property.Name is not ("training" or "heldout"))
            {
                problems.Add($"points.{property.Name}: unknown field; allowed: training, heldout");
            }
        }

        int training = element.TryGetProperty("training", out var t) ? Integer(t, "points.training", 2, MaxPoints, problems) : Missing("points.training", problems);
        int heldOut = element.TryGetProperty("heldout", out var h) ? Integer(h, "points.heldout", 0, MaxPoints, problems) : Missing("points.heldout", problems);
        return (training, heldOut);
    }

    /// <summary>Either a built-in source by name or a user's program as an object.</summary>
    private static (ExternalLinearCommand? Command, LinearSource Source) ReadLinear(JsonElement element, List<string> problems)
    {
        if (element.ValueKind == JsonValueKind.String && ParameterCatalog.LinearSources.TryGetValue(element.GetString()!, out var source))
        {
            return (null, source);
        }

        if (element.ValueKind != JsonValueKind.Object)
        {
            string names = string.Join(", ", ParameterCatalog.LinearSources.Keys.Select(n => $"\"{n}\""));
            problems.Add(
                $"linear: must be one of {names} (built-in sources) or an object {{\"command\": [program, args...], \"timeout_seconds\": s, \"k_min\": ..., \"k_max\": ...}} (your own program), got {element.GetRawText()}");
            return (null, LinearSource.Fit);
        }

        foreach (var property in element.EnumerateObject())
        {
            if (property.Name is not ("command" or "timeout_seconds" or "k_min" or "k_max"))
            {
                problems.Add($"linear.{property.Name}: unknown field; allowed: command, timeout_seconds, k_min, k_max");
            }
        }

        var command = new List<string>();
        if (!element.TryGetProperty("command", out var commandElement) || commandElement.ValueKind != JsonValueKind.Array || commandElement.GetArrayLength() == 0)
        {
            problems.Add("linear.command: must be a non-empty array: the program, then its arguments (run without a shell)");
        }
        else
        {
            foreach (var item in commandElement.EnumerateArray())
            {
                if (item.ValueKind != JsonValueKind.String || string.IsNullOrWhiteSpace(item.GetString()))
                {
                    problems.Add("linear.command: every entry must be a non-empty string");
                    break;
                }

                command.Add(item.GetString()!);
            }
        }

        double timeout = element.TryGetProperty("timeout_seconds", out var tElement) ? Number(tElement, "linear.timeout_seconds", problems) ?? 0 : 600;
        double kMin = element.TryGetProperty("k_min", out var loElement) ? Number(loElement, "linear.k_min", problems) ?? 0 : 1e-4;
        double kMax = element.TryGetProperty("k_max", out var hiElement) ? Number(hiElement, "linear.k_max", problems) ?? 0 : 50;
        return (new ExternalLinearCommand(command, timeout, kMin, kMax), LinearSource.Fit);
    }

    private static string? String(JsonElement root, string field, List<string> problems)
    {
        if (!root.TryGetProperty(field, out var element))
        {
            problems.Add($"{field}: missing");
            return null;
        }

        return StringValue(element, field, problems);
    }

    private static string? StringValue(JsonElement element, string field, List<string> problems)
    {
        if (element.ValueKind != JsonValueKind.String)
        {
            problems.Add($"{field}: must be a string, got {element.GetRawText()}");
            return null;
        }

        return element.GetString();
    }

    private static double? Required(JsonElement parent, string name, string field, List<string> problems)
    {
        if (!parent.TryGetProperty(name, out var element))
        {
            problems.Add($"{field}: missing");
            return null;
        }

        return Number(element, field, problems);
    }

    private static double? Number(JsonElement element, string field, List<string> problems)
    {
        if (element.ValueKind != JsonValueKind.Number || !element.TryGetDouble(out double value) || !double.IsFinite(value))
        {
            problems.Add($"{field}: must be a finite number, got {element.GetRawText()}");
            return null;
        }

        return value;
    }

    private static double[] NumberArray(JsonElement element, string field, List<string> problems)
    {
        if (element.ValueKind != JsonValueKind.Array)
        {
            problems.Add($"{field}: must be an array of numbers, got {element.GetRawText()}");
            return [];
        }

        var values = new List<double>();
        int index = 0;
        foreach (var item in element.EnumerateArray())
        {
            if (Number(item, $"{field}[{index}]", problems) is { } value)
            {
                values.Add(value);
            }

            index++;
        }

        return values.Count == index ? [.. values] : [];
    }

    private static int Integer(JsonElement element, string field, int min, int max, List<string> problems)
    {
        if (element.ValueKind != JsonValueKind.Number || !element.TryGetInt32(out int value) || value < min || value > max)
        {
            problems.Add($"{field}: must be an integer in [{min}, {max}], got {element.GetRawText()}");
            return 0;
        }

        return value;
    }

    private static int Missing(string field, List<string> problems)
    {
        problems.Add($"{field}: missing");
        return 0;
    }
}
