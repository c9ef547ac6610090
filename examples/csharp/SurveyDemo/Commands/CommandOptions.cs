using System.Globalization;

namespace Sibyl.Demo.Commands;

/// <summary>Options of one subcommand: <c>--name value</c> pairs and <c>--flag</c> switches, every number invariant-culture.</summary>
public sealed class CommandOptions
{
    private readonly Dictionary<string, string> _values = new(StringComparer.Ordinal);
    private readonly HashSet<string> _flags = new(StringComparer.Ordinal);
    private readonly HashSet<string> _known;

    /// <summary>Parses <paramref name="args"/>; names in <paramref name="flags"/> take no value.</summary>
    /// <exception cref="ArgumentException">An unknown option, a missing value or a stray argument.</exception>
    public CommandOptions(IReadOnlyList<string> args, IEnumerable<string> valued, IEnumerable<string> flags)
    {
        ArgumentNullException.ThrowIfNull(args);
        var flagSet = new HashSet<string>(flags, StringComparer.Ordinal);
        _known = new HashSet<string>(valued, StringComparer.Ordinal);
        for (int i = 0; i < args.Count; i++)
        {
            string name = args[i];
            if (flagSet.Contains(name))
            {
                _flags.Add(name);
            }
            else if (_known.Contains(name))
            {
                _values[name] = i + 1 < args.Count ? args[++i] : throw new ArgumentException($"{name} needs a value");
            }
            else
            {
                throw new ArgumentException($"unknown argument '{name}'; see --help");
            }
        }
    }

    /// <summary>True when the switch was given.</summary>
    public bool Has(string flag) => _flags.Contains(flag);

    /// <summary>The value of a required option.</summary>
    /// <exception cref="ArgumentException">Missing.</exception>
    public string Required(string name) => _values.TryGetValue(name, out var v) ? v : throw new ArgumentException($"{name} is required; see --help");

    /// <summary>The value of an option, or null.</summary>
    public string? Optional(string name) => _values.GetValueOrDefault(name);

    /// <summary>An integer option with a default.</summary>
    /// <exception cref="ArgumentException">Not an integer.</exception>
    public int Integer(string name, int fallback) =>
        _values.TryGetValue(name, out var v)
            ? int.TryParse(v, NumberStyles.Integer, CultureInfo.InvariantCulture, out int n) ? n : throw new ArgumentException($"{name}: '{v}' is not an integer")
            : fallback;
}
