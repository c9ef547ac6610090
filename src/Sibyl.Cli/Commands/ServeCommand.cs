using Microsoft.Extensions.Logging;
using Sibyl.Cli.Arguments;
using Sibyl.Emulation.Emulators;
using Sibyl.Server;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl serve NAME=EMULATOR ...</c>: serves emulators over gRPC until SIGINT or SIGTERM.</summary>
internal static class ServeCommand
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Serve);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args, new HashSet<string>(StringComparer.Ordinal) { "verbose" });
        var defaults = new SibylServerOptions();
        var options = defaults with
        {
            Host = arguments.Option("host") ?? defaults.Host,
            Port = arguments.IntegerOption("port", defaults.Port, 0, 65535),
            MaxBatch = arguments.IntegerOption("max-batch", defaults.MaxBatch, 1, 10_000_000),
            MaxMessageBytes = arguments.IntegerOption("max-message-bytes", defaults.MaxMessageBytes, 1024, int.MaxValue),
            MaxKValues = arguments.IntegerOption("max-k", defaults.MaxKValues, 1, 10_000_000),
        };
        var level = arguments.HasFlag("verbose") ? LogLevel.Debug : LogLevel.Warning;
        arguments.MarkUsed(arguments.Parameters.Keys);
        arguments.RejectUnused("see sibyl serve --help");
        if (arguments.Parameters.Count == 0)
        {
            throw new UsageException("serve: give at least one NAME=EMULATOR");
        }

        var emulators = new List<KeyValuePair<string, SpectrumEmulator>>();
        foreach (var (name, path) in arguments.Parameters)
        {
            if (!File.Exists(path))
            {
                throw new UsageException($"serve: {name}: emulator '{path}' not found (make one with sibyl fit)");
            }

            emulators.Add(new(name, SpectrumEmulator.Load(path)));
        }

        // Logs go to stderr so that stdout carries only the one line saying where the server listens.
        var server = SibylServer.StartAsync(
            emulators,
            options,
            logging => logging.SetMinimumLevel(level).AddSimpleConsole(o => o.SingleLine = true).AddConsole(o => o.LogToStandardErrorThreshold = LogLevel.Trace))
            .GetAwaiter().GetResult();
        try
        {
            stdout.WriteLine($"sibyl serve: listening on {server.Address.GetLeftPart(UriPartial.Authority)} (gRPC {SibylServer.ServiceName}, health, reflection; Ctrl-C or SIGTERM stops): {string.Join("; ", server.Summaries)}");
            stdout.Flush();
            server.WaitForShutdownAsync().GetAwaiter().GetResult();
        }
        finally
        {
            server.DisposeAsync().AsTask().GetAwaiter().GetResult();
        }

        stderr.WriteLine("sibyl serve: stopped");
        return 0;
    }
}
