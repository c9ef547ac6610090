using MessagePack;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Training.Storage;

/// <summary>The stored form of a <see cref="BasisLayout"/>, shared by training sets and emulators.</summary>
[MessagePackObject]
public sealed class BasisLayoutContract
{
    /// <summary>Observable names.</summary>
    [Key(0)]
    public string[] Observables { get; set; } = [];

    /// <summary>Nuisance-parameter names.</summary>
    [Key(1)]
    public string[] Nuisance { get; set; } = [];

    /// <summary>Term names.</summary>
    [Key(2)]
    public string[] TermNames { get; set; } = [];

    /// <summary>Observable index of each term.</summary>
    [Key(3)]
    public int[] TermObservables { get; set; } = [];

    /// <summary>Fixed prefactor of each term.</summary>
    [Key(4)]
    public double[] TermPrefactors { get; set; } = [];

    /// <summary>Nuisance factors of each term.</summary>
    [Key(5)]
    public int[][] TermFactors { get; set; } = [];

    /// <summary>The stored form of <paramref name="layout"/>.</summary>
    public static BasisLayoutContract From(BasisLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        return new BasisLayoutContract
        {
            Observables = [.. layout.Observables],
            Nuisance = [.. layout.Nuisance],
            TermNames = [.. layout.Terms.Select(t => t.Name)],
            TermObservables = [.. layout.Terms.Select(t => t.Observable)],
            TermPrefactors = [.. layout.Terms.Select(t => t.Prefactor)],
            TermFactors = [.. layout.Terms.Select(t => t.NuisanceFactors.ToArray())],
        };
    }

    /// <summary>The layout, checked.</summary>
    /// <exception cref="CorruptFileException">The arrays disagree or refer to nothing.</exception>
    public BasisLayout ToLayout(string source)
    {
        int terms = TermNames.Length;
        if (TermObservables.Length != terms || TermPrefactors.Length != terms || TermFactors.Length != terms)
        {
            throw new CorruptFileException(source, "inconsistent basis layout: its arrays differ in length");
        }

        try
        {
            return new BasisLayout(
                Observables,
                Nuisance,
                [.. Enumerable.Range(0, terms).Select(t => new BasisTerm(TermNames[t], TermObservables[t], TermPrefactors[t], TermFactors[t]))]);
        }
        catch (ArgumentException e)
        {
            throw new CorruptFileException(source, $"inconsistent basis layout: {e.Message}");
        }
    }
}
