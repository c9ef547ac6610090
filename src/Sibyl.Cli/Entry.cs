namespace Sibyl.Cli;

/// <summary>Dispatches the <c>sibyl</c> subcommands.</summary>
internal static class Entry
{
    /// <summary>Runs the command line and returns the process exit code.</summary>
    public static int Run(string[] args)
    {
        Console.Error.WriteLine("usage: sibyl compute linear|matter [name=value ...]");
        return args.Length == 0 ? 2 : 0;
    }
}
