namespace Sibyl.Training.Runs;

/// <summary>A run folder holds results that this run must not overwrite or mix with (another build's chunks).</summary>
public sealed class RunConflictException : Exception
{
    /// <summary>Creates the exception.</summary>
    public RunConflictException(string message)
        : base(message)
    {
    }
}
