using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Loops;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Linear;

/// <summary>
/// Runs a user's linear-spectrum program for one point: the point's parameters go to its stdin as one JSON
/// object, and its stdout must be a table of the general-relativity P_L(k, z = 0) (see
/// <see cref="LinearTableText"/>) covering the requested k range. The program is run without a shell, killed
/// with its children when it exceeds the time limit, and any failure becomes an exception that names the
/// point's problem (exit code, the end of its stderr, the bad line), so that the run records it.
/// </summary>
public sealed class ExternalLinearProvider
{
    private readonly ExternalLinearCommand _command;

    /// <summary>Creates the provider for <paramref name="command"/>.</summary>
    public ExternalLinearProvider(ExternalLinearCommand command)
    {
        ArgumentNullException.ThrowIfNull(command);
        _command = command;
    }

    /// <summary>The JSON object a point's program reads on stdin.</summary>
    public string Request(CosmologyParameters p, int pointIndex)
    {
        ArgumentNullException.ThrowIfNull(p);
        using var buffer = new MemoryStream();
        using (var json = new Utf8JsonWriter(buffer))
        {
            json.WriteStartObject();
            json.WriteNumber("point", pointIndex);
            json.WriteNumber(ParameterCatalog.H.Name, p.H);
            json.WriteNumber(ParameterCatalog.OmegaBaryon.Name, p.OmegaBaryon);
            json.WriteNumber(ParameterCatalog.OmegaCdm.Name, p.OmegaCdm);
            json.WriteNumber(ParameterCatalog.SpectralIndex.Name, p.SpectralIndex);
            if (p.Ln10As is { } lnAs)
            {
                json.WriteNumber(ParameterCatalog.Ln10As.Name, lnAs);
            }
            else
            {
                json.WriteNumber(ParameterCatalog.Sigma8.Name, p.Sigma8 ?? double.NaN);
            }

            json.WriteNumber(ParameterCatalog.W0.Name, p.W0);
            json.WriteNumber(ParameterCatalog.Wa.Name, p.Wa);
            json.WriteNumber(ParameterCatalog.CmbTemperature.Name, p.CmbTemperature);
            json.WriteNumber("k_min", _command.KMin);
            json.WriteNumber("k_max", _command.KMax);
            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray());
    }

    /// <summary>Runs the program for one point and returns its table, checked to cover [k_min, k_max].</summary>
    /// <exception cref="ExternalLinearException">The program failed, timed out or wrote a bad table.</exception>
    public (double[] K, double[] P) Fetch(CosmologyParameters parameters, int pointIndex, CancellationToken cancellation)
    {
        var start = new ProcessStartInfo(_command.Command[0])
        {
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            StandardOutputEncoding = Encoding.UTF8,
        };
        foreach (string argument in _command.Command.Skip(1))
        {
            start.ArgumentList.Add(argument);
        }

        string program = _command.Command[0];
        using var process = new Process { StartInfo = start };
        try
        {
            process.Start();
        }
        catch (System.ComponentModel.Win32Exception e)
        {
            throw new ExternalLinearException($"linear program '{program}' could not start: {e.Message}");
        }

        var stdout = process.StandardOutput.ReadToEndAsync(cancellation);
        var stderr = process.StandardError.ReadToEndAsync(cancellation);
        try
        {
            process.StandardInput.Write(Request(parameters, pointIndex));
            process.StandardInput.Close();
        }
        catch (IOException)
        {
            // The program exited without reading its input; its exit code and stderr below say why.
        }

        using var timeout = CancellationTokenSource.CreateLinkedTokenSource(cancellation);
        timeout.CancelAfter(TimeSpan.FromSeconds(_command.TimeoutSeconds));
        try
        {
            process.WaitForExitAsync(timeout.Token).GetAwaiter().GetResult();
        }
        catch (OperationCanceledException)
        {
            process.Kill(entireProcessTree: true);
            cancellation.ThrowIfCancellationRequested();
            throw new ExternalLinearException(string.Create(CultureInfo.InvariantCulture, $"linear program '{program}' timed out after {_command.TimeoutSeconds:G} s and was killed"));
        }

        string output = stdout.GetAwaiter().GetResult();
        string errors = stderr.GetAwaiter().GetResult();
        if (process.ExitCode != 0)
        {
            throw new ExternalLinearException($"linear program '{program}' exited with code {process.ExitCode}{Tail(errors)}");
        }

        (double[] K, double[] P) table;
        try
        {
            table = LinearTableText.Parse(output.Split('\n'), $"output of linear program '{program}'");
        }
        catch (FormatException e)
        {
            throw new ExternalLinearException(e.Message);
        }

        // The plans require the resampled table to span [k_min, k_max] to LoopRange.RelativeTolerance; a looser slack
        // here would pass a table that then fails every point at the plans' range check.
        double slack = LoopRange.RelativeTolerance;
        if (table.K[0] > _command.KMin * (1 + slack) || table.K[^1] < _command.KMax * (1 - slack))
        {
            throw new ExternalLinearException(string.Create(
                CultureInfo.InvariantCulture,
                $"linear program '{program}' returned k in [{table.K[0]:G6}, {table.K[^1]:G6}] h/Mpc; the grid needs at least [{_command.KMin:G6}, {_command.KMax:G6}]"));
        }

        return table;
    }

    private static string Tail(string errors)
    {
        string trimmed = errors.Trim();
        if (trimmed.Length == 0)
        {
            return "";
        }

        return ": " + (trimmed.Length <= 400 ? trimmed : "…" + trimmed[^400..]).ReplaceLineEndings(" | ");
    }
}
