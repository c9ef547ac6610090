using Sibyl.Demo.Commands;
using Sibyl.Training.Specs;

namespace Sibyl.Demo;

/// <summary>The <c>survey-demo</c> program: make-data, fit, compare.</summary>
public static class Program
{
    private const string Usage = """
        usage: survey-demo COMMAND [options]   (COMMAND --help for each)

        The worked demo of an INVENTED survey (not any real survey):
          make-data   synthetic multipoles from the direct calculation plus Gaussian noise, and their covariance
          fit         affine-invariant ensemble sampler (Goodman & Weare 2010) on the emulator or the direct calculation
          compare     likelihoods of chain points from the emulator and the direct calculation, and their costs

        examples/survey/run-demo.sh runs everything end to end.
        """;

    /// <summary>Entry point; exit code 0 on success, 2 on bad input.</summary>
    public static int Main(string[] args)
    {
        ArgumentNullException.ThrowIfNull(args);
        if (args.Length == 0 || args[0] is "--help" or "-h")
        {
            Console.WriteLine(Usage);
            return args.Length == 0 ? 2 : 0;
        }

        var (run, help) = args[0] switch
        {
            "make-data" => ((Func<IReadOnlyList<string>, int>)MakeDataCommand.Run, MakeDataCommand.Help),
            "fit" => (FitCommand.Run, FitCommand.Help),
            "compare" => (CompareCommand.Run, CompareCommand.Help),
            _ => (null, Usage),
        };
        if (run is null || args.Contains("--help"))
        {
            Console.WriteLine(help);
            return run is null ? 2 : 0;
        }

        try
        {
            return run(args[1..]);
        }
        catch (Exception e) when (e is ArgumentException or IOException or InvalidDataException or GridSpecException)
        {
            Console.Error.WriteLine($"survey-demo {args[0]}: {e.Message}");
            return 2;
        }
    }
}
