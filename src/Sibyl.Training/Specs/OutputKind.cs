namespace Sibyl.Training.Specs;

/// <summary>Which direct calculation a grid trains on.</summary>
public enum OutputKind
{
    /// <summary>One-loop real-space matter spectrum (<c>matter</c>).</summary>
    Matter,

    /// <summary>One-loop redshift-space galaxy multipoles (<c>galaxy</c>).</summary>
    Galaxy,
}
