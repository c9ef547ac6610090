using System.Globalization;

namespace Sibyl.Cli.Arguments;

/// <summary>
/// Splits a command's arguments into name=value parameters and --options. Every name and option must be
/// consumed by the command; <see cref="RejectUnused"/> turns leftovers into a clear error instead of
/// silently ignoring a typo.
/// </summary>
internal sealed class CommandArguments
{
    private readonly Dictionary<string, string> _parameters = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string?> _options = new(StringComparer.Ordinal);
    private readonly HashSet<string> _used = new(StringComparer.Ordinal);

    public CommandArguments(IEnumerable<string> args, IReadOnlySet<string> flagOptions)
    {
        using var e = args.GetEnumerator();
        while (e.MoveNext())
        {
            string arg = e.Current;
            if (arg.StartsWith("--", StringComparison.Ordinal))
            {
                string name = arg[2..];
                int eq = name.IndexOf('=', StringComparison.Ordinal);
                if (eq >= 0)
                {
                    if (flagOptions.Contains(name[..eq]))
                    {
                        throw new UsageException($"--{name[..eq]}: takes no value");
                    }

                    _options[name[..eq]] = name[(eq + 1)..];
                }
                else if (flagOptions.Contains(name))
                {
                    _options[name] = null;
                }
                else
                {
                    _options[name] = e.MoveNext() ? e.Current : throw new UsageException($"--{name}: missing value");
                }

                continue;
            }

            int equals = arg.IndexOf('=', StringComparison.Ordinal);
            if (equals <= 0)
            {
                throw new UsageException($"'{arg}': expected name=value or an --option");
            }

            string key = arg[..equals];
            if (_parameters.ContainsKey(key))
            {
                throw new UsageException($"{key}: given more than once");
            }

            _parameters[key] = arg[(equals + 1)..];
        }
    }

    /// <summary>All name=value pairs, for the parameter catalog; each name it knows is marked used.</summary>
    public IReadOnlyDictionary<string, string> Parameters => _parameters;

    public void MarkUsed(IEnumerable<string> names)
    {
        foreach (var name in names)
        {
            _used.Add(name);
        }
    }

    public bool HasFlag(string name)
    {
        _used.Add("--" + name);
        return _options.ContainsKey(name);
    }

    public string? Option(string name)
    {
        _used.Add("--" + name);
        return _options.TryGetValue(name, out var v) ? v ?? throw new UsageException($"--{name}: missing value") : null;
    }

    public double NumberOption(string name, double fallback, double min, double max)
    {
        string? text = Option(name);
        if (text is null)
        {
            return fallback;
        }

        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value) || !double.IsFinite(value))
        {
            throw new UsageException($"--{name}: '{text}' is not a finite number");
        }

        if (value < min || value > max)
        {
            throw new UsageException(string.Create(CultureInfo.InvariantCulture, $"--{name}: must lie in [{min:G}, {max:G}], got {value:G}"));
        }

        return value;
    }

    public int IntegerOption(string name, int fallback, int min, int max)
    {
        string? text = Option(name);
        if (text is null)
        {
            return fallback;
        }

        if (!int.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out int value) || value < min || value > max)
        {
            throw new UsageException($"--{name}: must be an integer in [{min}, {max}], got '{text}'");
        }

        return value;
    }

    /// <summary>Fails on the first parameter or option that no one asked for.</summary>
    public void RejectUnused(string knownListHint)
    {
        foreach (var name in _parameters.Keys)
        {
            if (!_used.Contains(name))
            {
                throw new UsageException($"{name}: unknown parameter ({knownListHint})");
            }
        }

        foreach (var name in _options.Keys)
        {
            if (!_used.Contains("--" + name))
            {
                throw new UsageException($"--{name}: unknown option ({knownListHint})");
            }
        }
    }
}
