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
    }

    /// <summary>The offending parameter, as users write it.</summary>
    public string Name { get; }
}
