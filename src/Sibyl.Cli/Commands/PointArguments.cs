using System.Globalization;
using Sibyl.Cli.Arguments;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Loops;

namespace Sibyl.Cli.Commands;

/// <summary>The cosmology, redshift and k grid shared by every <c>compute</c> output.</summary>
/// <param name="Model">The cosmology with its linear spectrum.</param>
/// <param name="Redshift">Output redshift.</param>
/// <param name="K">Output wavenumbers, h/Mpc.</param>
/// <param name="Source">The built-in linear source, or null when <c>--table</c> supplied the spectrum.</param>
internal sealed record PointArguments(CosmologyModel Model, double Redshift, double[] K, LinearSource? Source)
{
    public const double DefaultKMin = 1e-3, DefaultKMax = 1.0;
    public const int DefaultKCount = 200;

    public static PointArguments Parse(CommandArguments args)
    {
        args.MarkUsed(ParameterCatalog.All.Select(d => d.Name).Append(ParameterCatalog.ModelName).Append(ParameterCatalog.LinearName).Append(ParameterCatalog.Redshift.Name));
        var parameters = ParameterCatalog.Build(args.Parameters);
        var source = ParameterCatalog.LinearSourceOf(args.Parameters);
        double z = args.Parameters.TryGetValue(ParameterCatalog.Redshift.Name, out var zText)
            ? ParameterCatalog.Redshift.Check(ParameterCatalog.ParseNumber(ParameterCatalog.Redshift.Name, zText))
            : ParameterCatalog.Redshift.Default;

        double kMin = args.NumberOption("kmin", DefaultKMin, 1e-5, 100);
        double kMax = args.NumberOption("kmax", DefaultKMax, 1e-5, 100);
        int count = args.IntegerOption("nk", DefaultKCount, 2, 100_000);
        if (!(kMax > kMin))
        {
            throw new UsageException($"--kmax: must exceed --kmin ({kMin})");
        }

        string? table = args.Option("table");
        CosmologyModel model;
        if (table is null)
        {
            model = CosmologyModel.Create(parameters, source);
        }
        else
        {
            if (args.Parameters.ContainsKey(ParameterCatalog.LinearName))
            {
                throw new UsageException($"{ParameterCatalog.LinearName}: --table supplies the linear spectrum; give one or the other, not both");
            }

            var (k, p) = LinearTableReader.Read(table);
            try
            {
                model = CosmologyModel.CreateFromTable(parameters, k, p);
            }
            catch (ArgumentException e) when (e is not ParameterOutOfRangeException)
            {
                throw new UsageException($"--table: {table}: {e.Message}");
            }

            if (kMin < model.Linear.KMin || kMax > model.Linear.KMax)
            {
                throw new UsageException($"--kmin/--kmax: the table covers k in [{model.Linear.KMin:G6}, {model.Linear.KMax:G6}] h/Mpc; ask for k inside it");
            }
        }

        return new PointArguments(model, z, LogGridFunction.LogGrid(kMin, kMax, count), table is null ? source : null);
    }

    /// <summary>One-loop outputs integrate over the linear table, so their k must sit a factor 10 inside it.</summary>
    public void RequireLoopRange()
    {
        double low = Model.Linear.KMin * LoopQuadrature.RangeMargin, high = Model.Linear.KMax / LoopQuadrature.RangeMargin;
        if (K[0] < low * (1 - LoopRange.RelativeTolerance) || K[^1] > high * (1 + LoopRange.RelativeTolerance))
        {
            throw new UsageException(string.Create(
                CultureInfo.InvariantCulture,
                $"--kmin/--kmax: one-loop outputs need k in [{low:G6}, {high:G6}] h/Mpc, a factor {LoopQuadrature.RangeMargin:G} inside the linear table's range"));
        }
    }
}
