using System.Globalization;
using System.Text;

namespace Sibyl.Demo.Survey;

/// <summary>
/// A multipole data vector with its covariance. Values are ordered multipole-major: all k of the first multipole,
/// then all k of the next, so index = slot·nk + i. Stored as two CSV files: the data (k, one column per multipole, then
/// one σ column per multipole) and the dense covariance in the same order.
/// </summary>
public sealed class DataVector
{
    /// <summary>Creates a data vector, checking sizes.</summary>
    /// <param name="k">Bin centres, h/Mpc.</param>
    /// <param name="ells">Multipoles ℓ.</param>
    /// <param name="values">Measured multipoles, (Mpc/h)³, multipole-major.</param>
    /// <param name="covariance">Covariance, (Mpc/h)⁶, same order.</param>
    /// <exception cref="ArgumentException">Sizes disagree.</exception>
    public DataVector(double[] k, int[] ells, double[] values, double[,] covariance)
    {
        ArgumentNullException.ThrowIfNull(k);
        ArgumentNullException.ThrowIfNull(ells);
        ArgumentNullException.ThrowIfNull(values);
        ArgumentNullException.ThrowIfNull(covariance);
        int n = k.Length * ells.Length;
        if (values.Length != n || covariance.GetLength(0) != n || covariance.GetLength(1) != n)
        {
            throw new ArgumentException($"a data vector of {ells.Length} multipoles × {k.Length} k values needs {n} values and an {n}×{n} covariance");
        }

        K = k;
        Ells = ells;
        Values = values;
        Covariance = covariance;
    }

    /// <summary>Bin centres, h/Mpc.</summary>
    public double[] K { get; }

    /// <summary>Multipoles ℓ, in order.</summary>
    public int[] Ells { get; }

    /// <summary>Values, multipole-major, (Mpc/h)³.</summary>
    public double[] Values { get; }

    /// <summary>Covariance, (Mpc/h)⁶.</summary>
    public double[,] Covariance { get; }

    /// <summary>Length of the vector.</summary>
    public int Length => Values.Length;

    /// <summary>Standard deviation √C_ii of entry <paramref name="index"/>.</summary>
    public double Sigma(int index) => Math.Sqrt(Covariance[index, index]);

    /// <summary>Writes the data CSV and the covariance CSV, numbers round-trippable.</summary>
    public void Write(string dataPath, string covariancePath, string header)
    {
        var data = new StringBuilder();
        data.Append("# ").AppendLine(header);
        data.AppendLine("# k in h/Mpc (bin centre), P_ell in (Mpc/h)^3 with the Poisson shot noise 1/nbar subtracted, sigma_ell = sqrt of the covariance's diagonal");
        data.Append("k,").Append(string.Join(',', Ells.Select(l => $"P{l}"))).Append(',').AppendLine(string.Join(',', Ells.Select(l => $"sigma{l}")));
        for (int i = 0; i < K.Length; i++)
        {
            var row = new List<double> { K[i] };
            row.AddRange(Ells.Select((_, s) => Values[(s * K.Length) + i]));
            row.AddRange(Ells.Select((_, s) => Sigma((s * K.Length) + i)));
            data.AppendLine(string.Join(',', row.Select(Format)));
        }

        var covariance = new StringBuilder();
        covariance.Append("# ").AppendLine(header);
        covariance.AppendLine(string.Create(CultureInfo.InvariantCulture, $"# covariance in (Mpc/h)^6, {Length} x {Length}, order: multipole-major ({string.Join(", ", Ells.Select(l => $"P{l}"))}), each over the {K.Length} k bins of the data file"));
        for (int a = 0; a < Length; a++)
        {
            covariance.AppendLine(string.Join(',', Enumerable.Range(0, Length).Select(b => Format(Covariance[a, b]))));
        }

        File.WriteAllText(dataPath, data.ToString());
        File.WriteAllText(covariancePath, covariance.ToString());
    }

    /// <summary>Reads what <see cref="Write"/> wrote.</summary>
    /// <exception cref="InvalidDataException">The files are malformed or disagree in size.</exception>
    public static DataVector Read(string dataPath, string covariancePath)
    {
        var lines = Rows(dataPath);
        if (lines.Count < 2)
        {
            throw new InvalidDataException($"{dataPath}: no data rows");
        }

        string[] header = lines[0];
        int multipoles = (header.Length - 1) / 2;
        int[] ells = [.. header.Skip(1).Take(multipoles).Select(h => int.Parse(h.AsSpan(1), CultureInfo.InvariantCulture))];
        var rows = lines.Skip(1).Select(r => r.Select(c => Parse(c, dataPath)).ToArray()).ToList();
        double[] k = [.. rows.Select(r => r[0])];
        var values = new double[multipoles * k.Length];
        for (int i = 0; i < k.Length; i++)
        {
            for (int s = 0; s < multipoles; s++)
            {
                values[(s * k.Length) + i] = rows[i][1 + s];
            }
        }

        var covarianceRows = Rows(covariancePath);
        var covariance = new double[values.Length, values.Length];
        if (covarianceRows.Count != values.Length || covarianceRows.Any(r => r.Length != values.Length))
        {
            throw new InvalidDataException($"{covariancePath}: expected a {values.Length} x {values.Length} matrix");
        }

        for (int a = 0; a < values.Length; a++)
        {
            for (int b = 0; b < values.Length; b++)
            {
                covariance[a, b] = Parse(covarianceRows[a][b], covariancePath);
            }
        }

        return new DataVector(k, ells, values, covariance);
    }

    private static string Format(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static double Parse(string text, string path) =>
        double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value)
            ? value
            : throw new InvalidDataException($"{path}: '{text}' is not a number");

    private static List<string[]> Rows(string path) =>
        [.. File.ReadLines(path).Where(l => l.Length > 0 && !l.StartsWith('#')).Select(l => l.Split(','))];
}
