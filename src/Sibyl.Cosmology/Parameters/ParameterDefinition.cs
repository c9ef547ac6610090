using System.Globalization;

namespace Sibyl.Cosmology.Parameters;

/// <summary>A numeric parameter users may set by name, with its default and allowed interval.</summary>
/// <param name="Name">Name on the command line and in grid specs (DESIGN.md trade symbols).</param>
/// <param name="Default">Value used when the user leaves it out; NaN when there is none.</param>
/// <param name="Min">Lower bound.</param>
/// <param name="MinInclusive">Whether <paramref name="Min"/> itself is allowed.</param>
/// <param name="Max">Upper bound.</param>
/// <param name="MaxInclusive">Whether <paramref name="Max"/> itself is allowed.</param>
/// <param name="Unit">Unit, or "" when dimensionless.</param>
/// <param name="Meaning">One-line description for help texts.</param>
public sealed record ParameterDefinition(
    string Name, double Default, double Min, bool MinInclusive, double Max, bool MaxInclusive, string Unit, string Meaning)
{
    /// <summary>The interval in mathematical notation, for example "(0, 2]".</summary>
    public string Range => string.Create(
        CultureInfo.InvariantCulture,
        $"{(MinInclusive ? "[" : "(")}{Min:G}, {Max:G}{(MaxInclusive ? "]" : ")")}");

    /// <summary>True when <paramref name="value"/> is finite and inside the interval.</summary>
    public bool Allows(double value) =>
        double.IsFinite(value)
        && (MinInclusive ? value >= Min : value > Min)
        && (MaxInclusive ? value <= Max : value < Max);

    /// <summary>Returns <paramref name="value"/> or throws naming this parameter and its range.</summary>
    /// <exception cref="ParameterOutOfRangeException">The value is not finite or outside the range.</exception>
    public double Check(double value)
    {
        if (!Allows(value))
        {
            throw new ParameterOutOfRangeException(
                Name, string.Create(CultureInfo.InvariantCulture, $"must be finite and lie in {Range}, got {value:G}"));
        }

        return value;
    }
}
