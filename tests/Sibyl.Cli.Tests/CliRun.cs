namespace Sibyl.Cli.Tests;

/// <summary>Runs the command line in-process and captures its streams.</summary>
internal sealed record CliRun(int ExitCode, string Stdout, string Stderr)
{
    public static CliRun Of(params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        int code = Entry.Run(args, stdout, stderr);
        return new CliRun(code, stdout.ToString(), stderr.ToString());
    }
}
