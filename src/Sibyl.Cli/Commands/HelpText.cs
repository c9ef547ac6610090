using System.Globalization;
using System.Text;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Cli.Commands;

/// <summary>Help texts; parameter lists come from the catalog so they never drift from the code.</summary>
internal static class HelpText
{
    public const string Usage = """
        usage: sibyl <command> [arguments]

        commands:
          compute linear [name=value ...] [options]   linear spectrum P_lin and its no-wiggle partner P_nw
          compute matter [name=value ...] [options]   one-loop real-space matter spectrum, IR-resummed
          compute galaxy [name=value ...] [options]   one-loop redshift-space galaxy multipoles P0, P2, P4

        sibyl compute --help lists every parameter with its default, range and unit.
        """;

    public static string Compute()
    {
        var text = new StringBuilder();
        text.Append("""
            usage: sibyl compute linear|matter|galaxy [name=value ...] [options]

            Writes a CSV (header row, invariant culture, round-trip precision) to stdout or --out;
            growth D, f and sigma8 at z go to stderr. Units: k in h/Mpc, P in (Mpc/h)^3.

            parameters (name=value; defaults in brackets):
            """);
        text.Append('\n');
        foreach (var d in ParameterCatalog.All.Append(ParameterCatalog.Redshift))
        {
            Describe(text, d);
        }

        text.Append(CultureInfo.InvariantCulture, $"  {ParameterCatalog.ModelName,-11} [lcdm] one of {string.Join(", ", ParameterCatalog.Models.Keys)}\n");
        text.Append("\ncompute matter also takes:\n");
        Describe(text, MatterLayout.SoundSpeedDefinition);
        text.Append("\ncompute galaxy also takes (nuisance parameters):\n");
        foreach (var d in GalaxyLayout.Nuisance)
        {
            Describe(text, d);
        }

        text.Append(CultureInfo.InvariantCulture, $$"""

            options:
              --kmin K   [{{PointArguments.DefaultKMin:G}}] smallest output k, h/Mpc
              --kmax K   [{{PointArguments.DefaultKMax:G}}] largest output k, h/Mpc (matter and galaxy need k a factor
                         10 inside the linear table: [1e-4, 10] for the fit)
              --nk N     [{{PointArguments.DefaultKCount}}] number of log-spaced k values
              --table F  linear P(k) at z = 0 of the GR counterpart, two columns k, P (replaces the fit;
                         its amplitude replaces ln10As/sigma8; never extrapolated; loops integrate
                         over its range only, so give it a wide one, e.g. 1e-5 to 50 h/Mpc)
              --out F    write the CSV to F (atomically) instead of stdout
              --plot F   also write a PNG figure to F
              --basis    compute galaxy: also write every basis term (one column each)
              --help     this text

            """);
        return text.ToString();
    }

    private static void Describe(StringBuilder text, ParameterDefinition d)
    {
        string value = double.IsNaN(d.Default) ? "unset" : d.Default.ToString("G", CultureInfo.InvariantCulture);
        string unit = d.Unit.Length > 0 ? " " + d.Unit : "";
        text.Append(CultureInfo.InvariantCulture, $"  {d.Name,-11} [{value}{unit}] in {d.Range}: {d.Meaning}\n");
    }
}
