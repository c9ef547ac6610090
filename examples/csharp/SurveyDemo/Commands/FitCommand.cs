using System.Diagnostics;
using System.Globalization;
using System.Text;
using Sibyl.Demo.Figures;
using Sibyl.Demo.Likelihood;
using Sibyl.Demo.Sampling;
using Sibyl.Demo.Survey;
using Sibyl.Demo.Theory;

namespace Sibyl.Demo.Commands;

/// <summary>
/// <c>fit</c>: samples the posterior of the invented survey's data with the affine-invariant ensemble sampler, on the
/// emulator or the direct calculation, and reports the posterior against the injected values.
/// </summary>
public static class FitCommand
{
    /// <summary>Usage text.</summary>
    public const string Help = """
        usage: survey-demo fit --scenario FILE --data FOLDER (--emulator FILE | --server URL [--served-name NAME] | --direct GRID_SPEC) --out FOLDER
                               [--walkers N] [--steps N] [--burn-in N] [--seed N]

        Samples the cosmological parameters of the theory's box and the scenario's sampled nuisance parameters
        (flat priors; proposals outside them are rejected without calling the theory), with the scenario's
        marginalised nuisance parameters integrated out analytically under their Gaussian priors and every
        other nuisance parameter fixed at its hidden value. Sampler: the affine-invariant ensemble sampler of
        Goodman & Weare (2010), stretch move with a = 2, walkers updated in two halves, each half in one batch.
        Walkers start in a small ball around the box centre and the scenario's start values.

        options:
          --walkers N   [32] walkers (even, at least twice the number of parameters)
          --steps N     [2000] steps of the ensemble
          --burn-in N   [steps / 2] steps left out of the summaries
          --seed N      [1] seed of the starting ball and of the sampler

        writes FOLDER/chain.csv, FOLDER/posterior.txt (means, 68% intervals, injected values, acceptance,
        autocorrelation times, wall-clock time per likelihood), FOLDER/corner.png and FOLDER/bestfit.png.
        """;

    /// <summary>Runs the command; returns the exit code.</summary>
    public static int Run(IReadOnlyList<string> args)
    {
        var options = new CommandOptions(args, ["--scenario", "--data", "--emulator", "--direct", "--server", "--served-name", "--out", "--walkers", "--steps", "--burn-in", "--seed"], []);
        var scenario = SurveyScenario.Load(options.Required("--scenario"));
        string dataFolder = options.Required("--data"), folder = options.Required("--out");
        Directory.CreateDirectory(folder);
        var data = DataVector.Read(Path.Combine(dataFolder, "data.csv"), Path.Combine(dataFolder, "covariance.csv"));
        var theory = TheoryChoice.Open(options, scenario);
        int walkers = options.Integer("--walkers", 32), steps = options.Integer("--steps", 2000), seed = options.Integer("--seed", 1);
        int burnIn = options.Integer("--burn-in", steps / 2);
        if (burnIn < 0 || burnIn >= steps)
        {
            throw new ArgumentException("--burn-in must lie in [0, steps)");
        }

        var layout = theory.PredictAsync([[.. theory.Min.Zip(theory.Max, (a, b) => 0.5 * (a + b))]]).GetAwaiter().GetResult()[0].Layout;
        var likelihood = new MultipoleLikelihood(data, layout, scenario);
        var posterior = new SurveyPosterior(theory, likelihood, scenario, data.K);
        if (walkers < 2 * posterior.Dimension)
        {
            throw new ArgumentException($"--walkers must be at least {2 * posterior.Dimension} (twice the {posterior.Dimension} parameters)");
        }

        var start = StartingBall(posterior, scenario, walkers, seed);
        Console.Error.WriteLine($"fit: {posterior.Dimension} parameters ({string.Join(", ", posterior.Names)}), {walkers} walkers x {steps} steps on the {theory.Description}");
        var clock = Stopwatch.StartNew();
        int report = Math.Max(1, steps / 10);
        var chain = new EnsembleSampler(seed).Run(posterior, start, steps, s =>
        {
            if (s % report == 0)
            {
                Console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"fit: step {s}/{steps}, {clock.Elapsed.TotalSeconds:F1} s"));
            }
        });
        clock.Stop();

        string header = $"INVENTED survey '{scenario.Name}' (not any real survey); ensemble sampler chain on the {theory.Description}";
        ChainFile.Write(Path.Combine(folder, "chain.csv"), chain, posterior.Names, header);
        var samples = chain.Samples(burnIn).ToList();
        double[] injected = [.. TheoryChoice.HiddenPoint(theory, scenario), .. scenario.SampledNuisance.Select(s => scenario.HiddenNuisance[s.Name])];
        var best = BestSample(chain, burnIn);
        var bestValue = posterior.Likelihoods([best])[0];
        string summary = Summary(scenario, theory, posterior, likelihood, chain, burnIn, samples, injected, best, bestValue, clock.Elapsed);
        File.WriteAllText(Path.Combine(folder, "posterior.txt"), summary);
        Console.Write(summary);

        CornerFigure.Save(Path.Combine(folder, "corner.png"), posterior.Names, samples, injected);
        int d = theory.ParameterNames.Count;
        var bestSpectra = theory.PredictAsync([best[..d]]).GetAwaiter().GetResult()[0];
        var model = likelihood.Model(bestSpectra, likelihood.Nuisance(best.AsSpan(d), bestValue.LinearMean));
        MultipoleFigure.Save(Path.Combine(folder, "bestfit.png"), $"Invented survey {scenario.Name}: data vs best fit ({theory.Description})", data, model, "best fit");
        Console.Error.WriteLine($"fit: wrote {folder}/chain.csv, posterior.txt, corner.png, bestfit.png");
        return 0;
    }

    /// <summary>
    /// Walkers uniformly in a ball of ±1 % of each prior's width around the box centre (cosmology) and the scenario's
    /// start values (nuisance): deliberately not at the injected point, so the burn-in has to find the posterior.
    /// </summary>
    private static double[][] StartingBall(SurveyPosterior posterior, SurveyScenario scenario, int walkers, int seed)
    {
        double[] min = posterior.Min, max = posterior.Max;
        int d = posterior.Dimension - scenario.SampledNuisance.Length;
        double[] centre = [.. min.Take(d).Zip(max.Take(d), (a, b) => 0.5 * (a + b)), .. scenario.SampledNuisance.Select(s => s.Start)];
        // A stream apart from the sampler's (which takes the seed itself), so the ball does not echo its first draws.
        var random = new Random(seed ^ 0x5EED);
        var start = new double[walkers][];
        for (int w = 0; w < walkers; w++)
        {
            do
            {
                start[w] = [.. centre.Select((c, q) => c + (0.01 * (max[q] - min[q]) * ((2.0 * random.NextDouble()) - 1.0)))];
            }
            while (!posterior.InPrior(start[w]));
        }

        return start;
    }

    private static double[] BestSample(EnsembleChain chain, int burnIn)
    {
        (int step, int walker) best = (burnIn, 0);
        for (int s = burnIn; s < chain.Steps; s++)
        {
            for (int w = 0; w < chain.Walkers; w++)
            {
                if (chain.LogDensity(s, w) > chain.LogDensity(best.step, best.walker))
                {
                    best = (s, w);
                }
            }
        }

        return chain.Position(best.step, best.walker).ToArray();
    }

    private static string Summary(
        SurveyScenario scenario,
        ISpectrumTheory theory,
        SurveyPosterior posterior,
        MultipoleLikelihood likelihood,
        EnsembleChain chain,
        int burnIn,
        List<double[]> samples,
        double[] injected,
        double[] best,
        LikelihoodValue bestValue,
        TimeSpan elapsed)
    {
        var text = new StringBuilder();
        var c = CultureInfo.InvariantCulture;
        text.AppendLine(c, $"# INVENTED survey '{scenario.Name}' (not any real survey): posterior from the {theory.Description}");
        text.AppendLine(c, $"# {chain.Walkers} walkers x {chain.Steps} steps, burn-in {burnIn} steps, {samples.Count} samples kept; acceptance fraction {chain.AcceptanceFraction:F3}");
        text.AppendLine(c, $"# marginalised analytically (Gaussian priors): {string.Join(", ", scenario.MarginalisedNuisance.Select(m => $"{m.Name} ~ N({m.Mean:G}, {m.Sigma:G}^2)"))}");
        var fixedNames = scenario.HiddenNuisance.Keys.Except(likelihood.SampledNames).Except(likelihood.MarginalisedNames);
        text.AppendLine(c, $"# fixed at their hidden values: {string.Join(", ", fixedNames.Select(n => $"{n} = {scenario.HiddenNuisance[n]:G}"))}");
        text.AppendLine("parameter    injected        mean          sd     68% interval (16th-84th)        (mean-injected)/sd   tau [steps]");
        for (int q = 0; q < posterior.Dimension; q++)
        {
            var s = PosteriorSummary.Of([.. samples.Select(x => x[q])]);
            double tau = AutocorrelationTime.Estimate(chain, q, burnIn);
            text.AppendLine(c, $"{posterior.Names[q],-10} {injected[q],10:G5} {s.Mean,11:G5} {s.StandardDeviation,11:G3}   [{s.Lower,10:G5}, {s.Upper,10:G5}]   {(s.Mean - injected[q]) / s.StandardDeviation,12:F2}   {tau,10:F1}");
        }

        text.AppendLine(c, $"# best sample: {string.Join(", ", posterior.Names.Select((n, q) => $"{n} = {best[q]:G5}"))}");
        text.AppendLine(c, $"#   its marginalised parameters at their conditional mean: {string.Join(", ", likelihood.MarginalisedNames.Select((n, q) => $"{n} = {bestValue.LinearMean[q]:G4}"))}");
        text.AppendLine(c, $"#   chi2 there {bestValue.Chi2:F2} for {posterior.Names.Count} + {likelihood.MarginalisedNames.Count} fitted parameters and the data's {scenario.Multipoles.Length * scenario.BinCentres().Length} points");
        double perEvaluation = elapsed.TotalMilliseconds / Math.Max(1, posterior.Evaluations);
        text.AppendLine(c, $"# wall clock: {elapsed.TotalSeconds:F1} s for {posterior.Evaluations} likelihood evaluations ({perEvaluation:F4} ms each, {posterior.TheoryTime.TotalMilliseconds / Math.Max(1, posterior.Evaluations):F4} ms of it in the theory; {Environment.ProcessorCount} cores)");
        return text.ToString();
    }
}
