using Sibyl.Demo.Survey;
using Sibyl.Demo.Theory;
using Sibyl.Emulation.Emulators;
using Sibyl.Training.Specs;

namespace Sibyl.Demo.Commands;

/// <summary>
/// Opens the theory a command line asks for: <c>--emulator FILE</c> (in this process), <c>--server URL</c> with
/// <c>--served-name NAME</c> (an emulator served by sibyl serve) or <c>--direct SPEC</c>.
/// </summary>
public static class TheoryChoice
{
    /// <summary>The theory, at the scenario's redshift.</summary>
    /// <exception cref="ArgumentException">None or several of the choices given.</exception>
    public static ISpectrumTheory Open(CommandOptions options, SurveyScenario scenario)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(scenario);
        string? emulator = options.Optional("--emulator"), direct = options.Optional("--direct"), server = options.Optional("--server");
        return (emulator, direct, server) switch
        {
            ({ } file, null, null) => new EmulatorTheory(SpectrumEmulator.Load(file), Path.GetFileName(file), scenario.Redshift),
            (null, { } spec, null) => new DirectTheory(GridSpecReader.ReadFile(spec), scenario.Redshift),
            (null, null, { } url) => ServerTheory.ConnectAsync(new Uri(url), options.Optional("--served-name") ?? "survey", scenario.Redshift).GetAwaiter().GetResult(),
            _ => throw new ArgumentException("give exactly one of --emulator FILE, --server URL and --direct SPEC"),
        };
    }

    /// <summary>The scenario's hidden cosmology in the theory's parameter order.</summary>
    /// <exception cref="ArgumentException">A parameter of the theory has no hidden value.</exception>
    public static double[] HiddenPoint(ISpectrumTheory theory, SurveyScenario scenario)
    {
        ArgumentNullException.ThrowIfNull(theory);
        ArgumentNullException.ThrowIfNull(scenario);
        return [.. theory.ParameterNames.Select(n => scenario.HiddenCosmology.TryGetValue(n, out double v)
            ? v
            : throw new ArgumentException($"the scenario's hidden_cosmology has no value of {n}, a parameter of the theory's box"))];
    }
}
