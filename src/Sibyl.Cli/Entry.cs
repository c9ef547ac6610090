using Sibyl.Cli.Arguments;
using Sibyl.Cli.Commands;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cli;

/// <summary>Dispatches the <c>sibyl</c> subcommands and maps failures to exit codes.</summary>
internal static class Entry
{
    /// <summary>Bad input.</summary>
    public const int UsageError = 2;

    /// <summary>A file could not be read or written.</summary>
    public const int IoError = 1;

    /// <summary>Runs the command line and returns the process exit code.</summary>
    public static int Run(string[] args) => Run(args, Console.Out, Console.Error);

    /// <summary>Runs with explicit streams, for tests.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        try
        {
            return args switch
            {
                [] or ["--help" or "-h" or "help"] => Help(stdout),
                ["compute", .. var rest] => ComputeCommand.Run(rest, stdout, stderr),
                _ => throw new UsageException($"unknown command '{args[0]}'; try sibyl --help"),
            };
        }
        catch (UsageException e)
        {
            stderr.WriteLine($"sibyl: {e.Message}");
            return UsageError;
        }
        catch (ParameterOutOfRangeException e)
        {
            stderr.WriteLine($"sibyl: {e.Message.Split(" (Parameter '")[0]}");
            return UsageError;
        }
        catch (ArgumentException e)
        {
            // Physics code validates its inputs with ArgumentException; anything reaching here came from
            // the user's values, so it is reported like any other bad input.
            stderr.WriteLine($"sibyl: {e.Message}");
            return UsageError;
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
