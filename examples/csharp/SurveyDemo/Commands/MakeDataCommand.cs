using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using Sibyl.Demo.Figures;
using Sibyl.Demo.Likelihood;
using Sibyl.Demo.Survey;
using Sibyl.Demo.Theory;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Training.Specs;

namespace Sibyl.Demo.Commands;

/// <summary>
/// <c>make-data</c>: the synthetic data vector of the invented survey. The direct calculation at the hidden parameters
/// gives the true multipoles; the Gaussian covariance of the scenario's volume and number density, evaluated with them,
/// gives the errors; seeded Gaussian noise with that covariance is added.
/// </summary>
public static class MakeDataCommand
{
    /// <summary>Usage text.</summary>
    public const string Help = """
        usage: survey-demo make-data --scenario FILE --spec GRID_SPEC --out FOLDER

        The synthetic data of an invented survey: the direct one-loop multipoles at the scenario's hidden
        parameters (fixed parameters, gravity model and k grid from the grid spec, whose k values must be the
        scenario's bin centres), plus Gaussian noise drawn with the scenario's noise_seed from the Gaussian
        covariance of the multipoles (Grieb et al. 2016) for its volume and number density.

        writes FOLDER/data.csv (k, P_ell, sigma_ell), FOLDER/covariance.csv, FOLDER/truth.csv (the noiseless
        multipoles) and FOLDER/data.png (data with error bars against the truth).
        """;

    /// <summary>Runs the command; returns the exit code.</summary>
    public static int Run(IReadOnlyList<string> args)
    {
        var options = new CommandOptions(args, ["--scenario", "--spec", "--out"], []);
        var scenario = SurveyScenario.Load(options.Required("--scenario"));
        string folder = options.Required("--out");
        Directory.CreateDirectory(folder);
        var theory = new DirectTheory(GridSpecReader.ReadFile(options.Required("--spec")), scenario.Redshift);
        double[] k = scenario.BinCentres();
        if (k.Length != theory.K.Count || k.Zip(theory.K).Any(p => Math.Abs(p.First - p.Second) > 1e-9))
        {
            throw new ArgumentException("the grid spec's k values must be the scenario's bin centres");
        }

        var basis = theory.PredictAsync([TheoryChoice.HiddenPoint(theory, scenario)]).GetAwaiter().GetResult()[0];
        double[] nuisance = [.. basis.Layout.Nuisance.Select(n => scenario.HiddenNuisance.TryGetValue(n, out double v) ? v : throw new ArgumentException($"hidden_nuisance has no {n}"))];
        var all = new double[3][];
        for (int l = 0; l < 3; l++)
        {
            all[l] = new double[k.Length];
            basis.Assemble(nuisance, l, all[l]);
        }

        int nk = k.Length, m = scenario.Multipoles.Length;
        var covariance = new double[nk * m, nk * m];
        for (int i = 0; i < nk; i++)
        {
            double modes = GaussianCovariance.ModeCount(scenario.Volume, k[i], scenario.KBins.Width);
            var block = GaussianCovariance.Block(scenario.Multipoles, all[0][i], all[1][i], all[2][i], scenario.ShotNoise, modes);
            for (int a = 0; a < m; a++)
            {
                for (int b = 0; b < m; b++)
                {
                    covariance[(a * nk) + i, (b * nk) + i] = block[a, b];
                }
            }
        }

        double[] truth = [.. scenario.Multipoles.SelectMany(l => all[Multipoles.Slot(l)])];
        var lower = Matrix<double>.Build.DenseOfArray(covariance).Cholesky().Factor;
        var random = new Random(scenario.NoiseSeed);
        var normal = Vector<double>.Build.Dense(truth.Length, _ => StandardNormal(random));
        double[] values = (Vector<double>.Build.DenseOfArray(truth) + (lower * normal)).ToArray();
        var data = new DataVector(k, scenario.Multipoles, values, covariance);
        string header = $"INVENTED survey '{scenario.Name}' (not any real survey), z = {scenario.Redshift.ToString(CultureInfo.InvariantCulture)}; synthetic data from the direct calculation at the hidden parameters plus seeded Gaussian noise";
        data.Write(Path.Combine(folder, "data.csv"), Path.Combine(folder, "covariance.csv"), header);
        new DataVector(k, scenario.Multipoles, truth, covariance).Write(Path.Combine(folder, "truth.csv"), Path.Combine(folder, "truth-covariance.csv"), "noiseless multipoles at the hidden parameters (" + header + ")");
        MultipoleFigure.Save(Path.Combine(folder, "data.png"), $"Invented survey {scenario.Name}: synthetic data vs truth", data, truth, "truth");

        var likelihood = new MultipoleLikelihood(data, basis.Layout, scenario);
        var atTruth = likelihood.Evaluate(basis, [.. scenario.SampledNuisance.Select(s => scenario.HiddenNuisance[s.Name])]);
        double signalToNoise = Math.Sqrt(Vector<double>.Build.DenseOfArray(truth).DotProduct(Matrix<double>.Build.DenseOfArray(covariance).Cholesky().Solve(Vector<double>.Build.DenseOfArray(truth))));
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"make-data: {truth.Length} data points ({m} multipoles x {nk} k bins), total S/N {signalToNoise:F1}; chi2 of the noisy data against the truth {Chi2(values, truth, covariance):F1}; -2 ln L at the truth (linear nuisance marginalised) {atTruth.MinusTwoLnL:F1}"));
        Console.WriteLine($"make-data: wrote {folder}/data.csv, covariance.csv, truth.csv, data.png");
        return 0;
    }

    /// <summary>Box–Muller (one of the pair is enough here).</summary>
    private static double StandardNormal(Random random)
    {
        double u1 = 1.0 - random.NextDouble(), u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    private static double Chi2(double[] data, double[] model, double[,] covariance)
    {
        var r = Vector<double>.Build.DenseOfArray(data) - Vector<double>.Build.DenseOfArray(model);
        return r.DotProduct(Matrix<double>.Build.DenseOfArray(covariance).Cholesky().Solve(r));
    }
}
