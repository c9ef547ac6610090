using Sibyl.Cli.Arguments;
using Sibyl.Cli.Commands;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;
using Sibyl.Training.Storage;

namespace Sibyl.Cli;

/// <summary>Dispatches the <c>sibyl</c> subcommands and maps failures to exit codes.</summary>
internal static class Entry
{
    /// <summary>Bad input.</summary>
    public const int UsageError = 2;

    /// <summary>A file could not be read or written.</summary>
    public const int IoError = 1;

    /// <summary>A run finished, but some points failed (they are recorded).</summary>
    public const int PointsFailed = 3;

    /// <summary>An emulator check found errors above the limit the user set.</summary>
    public const int CheckFailed = 4;

    /// <summary>A direct calculation failed numerically (the message names what and where).</summary>
    public const int CalculationFailed = 5;

    /// <summary>Stopped by SIGINT or SIGTERM (128 + 2, the shell's convention for an interrupt).</summary>
    public const int Interrupted = 130;

    /// <summary>Runs the command line and returns the process exit code.</summary>
    public static int Run(string[] args) => Run(args, Console.Out, Console.Error, interactive: !Console.IsErrorRedirected);

    /// <summary>Runs with explicit streams, for tests.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, bool interactive = false)
    {
        try
        {
            return args switch
            {
                [] or ["--help" or "-h" or "help"] => Help(stdout),
                ["compute", .. var rest] => ComputeCommand.Run(rest, stdout, stderr),
                ["plan", .. var rest] => PlanCommand.Run(rest, stdout, stderr),
                ["run", .. var rest] => RunCommand.Run(rest, stdout, stderr, interactive),
                ["merge", .. var rest] => MergeCommand.Run(rest, stdout, stderr),
                ["fit", .. var rest] => FitCommand.Run(rest, stdout, stderr),
                ["check", .. var rest] => CheckCommand.Run(rest, stdout, stderr),
                ["quickstart", .. var rest] => QuickstartCommand.Run(rest, stdout, stderr, interactive),
                ["serve", .. var rest] => ServeCommand.Run(rest, stdout, stderr),
                ["ask", .. var rest] => AskCommand.Run(rest, stdout, stderr),
                _ => throw new UsageException($"unknown command '{args[0]}'; try sibyl --help"),
            };
        }
        catch (UsageException e)
        {
            stderr.WriteLine($"sibyl: {e.Message}");
            return UsageError;
        }
        catch (Exception e) when (e is GridSpecException or CorruptFileException or MergeException or RunConflictException)
        {
            // Bad input files: the message already names the file and every problem.
            stderr.WriteLine($"sibyl: {e.Message}");
            return UsageError;
        }
        catch (ArgumentException e)
        {
            // Physics code validates its inputs with ArgumentException; anything reaching here came from
            // the user's values, so it is reported like any other bad input.
            stderr.WriteLine($"sibyl: {e.Message}");
            return UsageError;
        }
        catch (ArithmeticException e)
        {
            stderr.WriteLine($"sibyl: the calculation failed: {e.Message}");
            return CalculationFailed;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            stderr.WriteLine($"sibyl: {e.Message}");
            return IoError;
        }
    }

    private static int Help(TextWriter stdout)
    {
        stdout.Write(HelpText.Usage);
        return 0;
    }
}
