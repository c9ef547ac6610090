namespace Sibyl.Training.Linear;

/// <summary>A user's linear-spectrum program failed for one point; the message says how.</summary>
public sealed class ExternalLinearException : Exception
{
    /// <summary>Creates the exception.</summary>
    public ExternalLinearException(string message)
        : base(message)
    {
    }
}
