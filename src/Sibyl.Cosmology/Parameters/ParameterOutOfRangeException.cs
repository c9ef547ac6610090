namespace Sibyl.Cosmology.Parameters;

/// <summary>A named parameter is missing, not a number, or outside its allowed range.</summary>
public sealed class ParameterOutOfRangeException : ArgumentException
{
    /// <summary>Creates the exception; the message names the parameter and what is allowed.</summary>
    /// <param name="name">Parameter name as users write it (for example <c>omega_b</c>).</param>
    /// <param name="problem">What is wrong and what is allowed, for example "must lie in (0, 0.1], got -0.1".</param>
    public ParameterOutOfRangeException(string name, string problem)
        : base($"{name}: {problem}", name)
    {
        Name = name;
        Message = $"{name}: {problem}";
    }

    /// <summary>The offending parameter, as users write it.</summary>
    public string Name { get; }

    /// <summary>
    /// "name: problem", without the " (Parameter 'name')" suffix <see cref="ArgumentException"/> appends: the name already
    /// leads the text, and the CLI, the run log and the server show it to users as it is.
    /// </summary>
    public override string Message { get; }
}
