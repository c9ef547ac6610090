using System.Diagnostics;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Compression;
using Sibyl.Emulation.Gaussian;
using Sibyl.Emulation.Validation;
using Sibyl.Training;
using Sibyl.Training.Storage;

namespace Sibyl.Emulation.Emulators;

/// <summary>
/// Fits an emulator to a training set: per redshift slice and basis term, transform the term over k, compress it
/// with principal components, fit Gaussian processes with a polynomial trend to the component coefficients as
/// functions of the unit-box parameters, then measure the result against the held-out points.
/// </summary>
public static class EmulatorFitter
{
    /// <summary>Fits and validates.</summary>
    /// <exception cref="ArgumentException">The training set has too few usable training points or no held-out points.</exception>
    public static SpectrumEmulator Fit(TrainingSet set, EmulatorFitOptions options, Action<string>? progress)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(options);
        var training = Enumerable.Range(0, set.Count).Where(i => set.IsTraining(i) && set.Error(i) is null).ToArray();
        var heldOut = Enumerable.Range(0, set.Count).Where(i => !set.IsTraining(i) && set.Error(i) is null).ToArray();
        int d = set.Spec.Varied.Count, nk = set.K.Length, terms = set.Layout.Terms.Count;
        int slices = set.Spec.VariesRedshift ? 1 : set.Spec.Redshifts.Count;
        if (training.Length < Math.Max(8, QuadraticTrend.FeatureCount(options.TrendDegree, d) + 2))
        {
            throw new ArgumentException($"the training set has {training.Length} usable training points; a degree-{options.TrendDegree} trend in {d} parameters needs more");
        }

        if (heldOut.Length == 0)
        {
            throw new ArgumentException("the training set has no usable held-out points, so the emulator's accuracy could not be measured; give points.heldout > 0 in the spec");
        }

        var warps = set.Spec.Varied.Select(v => SpectrumEmulator.WarpFor(v.Name, v.Min)).ToArray();
        var inputs = Matrix<double>.Build.Dense(training.Length, d, (i, q) => SpectrumEmulator.Warp(warps[q], set.Unit(training[i])[q]).Value);
        var blocks = new BlockContract[slices * terms];
        var coefficients = new Matrix<double>[slices * terms];
        for (int s = 0; s < slices; s++)
        {
            for (int t = 0; t < terms; t++)
            {
                int b = (s * terms) + t;
                (blocks[b], coefficients[b]) = Compress(set, training, s, t, nk, options);
            }
        }

        progress?.Invoke($"fit: {blocks.Sum(b => b.SingularValues.Length)} principal components over {blocks.Length} blocks (largest reconstruction error {blocks.Max(b => b.MaximumError):G2})");
        var groups = Groups(blocks, options.SeparateComponents);
        var processes = new ProcessContract[groups.Count];
        int finished = 0;
        var clock = Stopwatch.StartNew();
        Parallel.For(0, groups.Count, new ParallelOptions { MaxDegreeOfParallelism = options.Threads }, g =>
        {
            processes[g] = FitProcess(inputs, coefficients, groups[g], options);
            int done = Interlocked.Increment(ref finished);
            progress?.Invoke(string.Create(CultureInfo.InvariantCulture, $"fit: {done}/{groups.Count} Gaussian processes ({clock.Elapsed.TotalSeconds:F1} s)"));
        });

        var contract = new EmulatorContract
        {
            SpecJson = Training.Specs.GridSpecJson.Write(set.Spec),
            DesignHash = set.DesignHash,
            CodeFingerprint = set.CodeFingerprint,
            ParameterNames = [.. set.Spec.Varied.Select(v => v.Name)],
            Min = [.. set.Spec.Varied.Select(v => v.Min)],
            Max = [.. set.Spec.Varied.Select(v => v.Max)],
            K = set.K.ToArray(),
            Redshifts = set.Spec.VariesRedshift ? [] : [.. set.Spec.Redshifts],
            Layout = BasisLayoutContract.From(set.Layout),
            TrainingInputs = [.. Enumerable.Range(0, training.Length).SelectMany(i => Enumerable.Range(0, d).Select(q => inputs[i, q]))],
            Blocks = blocks,
            Processes = processes,
            Accuracy = Placeholder(terms, nk),
            InputWarps = [.. warps.Select(w => (int)w)],
        };
        var emulator = new SpectrumEmulator(contract, "new emulator");
        emulator.RecordAccuracy(Validate(emulator, set, heldOut));
        return emulator;
    }

    /// <summary>Compares the emulator with the training set's held-out points at every slice.</summary>
    public static AccuracyReport Validate(SpectrumEmulator emulator, TrainingSet set, IReadOnlyList<int> points)
    {
        ArgumentNullException.ThrowIfNull(emulator);
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(points);
        var predictor = emulator.CreatePredictor();
        var comparisons = points.SelectMany(i => Comparison.AtEverySlice(emulator, predictor, i, set.Parameters(i), set.Values(i))).ToList();
        return AccuracyReport.Measure("held-out", [.. set.Layout.Terms.Select(x => x.Name)], set.K.ToArray(), comparisons);
    }

    private static (BlockContract, Matrix<double>) Compress(TrainingSet set, int[] training, int slice, int term, int nk, EmulatorFitOptions options)
    {
        var data = Matrix<double>.Build.Dense(training.Length, nk);
        for (int i = 0; i < training.Length; i++)
        {
            var row = set.Spectra(training[i], slice).Term(term);
            for (int k = 0; k < nk; k++)
            {
                data[i, k] = row[k];
            }
        }

        bool log = data.Enumerate().All(v => v > 0.0);
        double[]? scale = null;
        if (log)
        {
            data.MapInplace(Math.Log);
        }
        else
        {
            scale = [.. Enumerable.Range(0, nk).Select(k =>
            {
                double rms = Math.Sqrt(data.Column(k).PointwisePower(2).Average());
                return rms > 0.0 ? rms : 1.0;
            })];
        }

        var pca = PrincipalComponents.Fit(data, new PrincipalComponentsOptions
        {
            Tolerance = options.ComponentTolerance,
            MaximumCount = Math.Min(options.MaxComponents, training.Length - 1),
            Scale = scale,
        });
        var block = new BlockContract
        {
            Transform = (int)(log ? TargetTransform.Log : TargetTransform.Linear),
            Mean = pca.Mean.ToArray(),
            Scale = pca.Scale.ToArray(),
            Basis = pca.Basis.ToArray(),
            SingularValues = pca.SingularValues.ToArray(),
            MaximumError = pca.MaximumError,
            RmsError = pca.RmsError,
            ExplainedFraction = pca.ExplainedFraction,
        };
        return (block, pca.Project(data));
    }

    private static List<(int Block, int Component)[]> Groups(BlockContract[] blocks, int separate)
    {
        var groups = new List<(int, int)[]>();
        for (int b = 0; b < blocks.Length; b++)
        {
            int count = blocks[b].SingularValues.Length;
            groups.AddRange(Enumerable.Range(0, Math.Min(separate, count)).Select(c => new[] { (b, c) }));
            if (count > separate)
            {
                groups.Add([.. Enumerable.Range(separate, count - separate).Select(c => (b, c))]);
            }
        }

        return groups;
    }

    private static ProcessContract FitProcess(Matrix<double> inputs, Matrix<double>[] coefficients, (int Block, int Component)[] outputs, EmulatorFitOptions options)
    {
        int n = inputs.RowCount;
        var targets = Matrix<double>.Build.Dense(n, outputs.Length, (i, j) => coefficients[outputs[j].Block][i, outputs[j].Component]);
        var trend = QuadraticTrend.Fit(inputs, targets, options.TrendDegree);
        var residual = targets.Clone();
        var row = new double[outputs.Length];
        var point = new double[inputs.ColumnCount];
        for (int i = 0; i < n; i++)
        {
            Array.Clear(row);
            for (int q = 0; q < point.Length; q++)
            {
                point[q] = inputs[i, q];
            }

            trend.Add(point, row, []);
            for (int j = 0; j < outputs.Length; j++)
            {
                residual[i, j] -= row[j];
            }
        }

        int subset = Math.Min(n, options.HyperparameterPoints);
        var gpOptions = new GaussianProcessOptions
        {
            Kernel = options.Kernel,
            Restarts = options.Restarts,
            MaximumIterations = options.MaxIterations,
            Seed = options.Seed,
            KeepCholeskyFactor = options.KeepVariance,
        };
        var model = GaussianProcessRegression.Fit(inputs.SubMatrix(0, subset, 0, inputs.ColumnCount), residual.SubMatrix(0, subset, 0, outputs.Length), gpOptions);
        if (subset < n)
        {
            model = GaussianProcessRegression.Condition(inputs, residual, options.Kernel, model.Hyperparameters, options.KeepVariance);
        }

        return new ProcessContract
        {
            Kernel = (int)model.Kernel,
            SignalVariance = model.Hyperparameters.SignalVariance,
            LengthScales = model.Hyperparameters.LengthScales.ToArray(),
            NoiseVariance = model.Hyperparameters.NoiseVariance,
            Alpha = model.Alpha.ToArray(),
            OutputMean = model.OutputMean.ToArray(),
            OutputScale = model.OutputScale.ToArray(),
            Cholesky = model.HasCholeskyFactor ? model.CholeskyFactor.ToArray() : null,
            LogMarginalLikelihood = model.LogMarginalLikelihood,
            TrendDegree = trend.Degree,
            TrendCoefficients = trend.Coefficients.ToArray(),
            OutputBlocks = [.. outputs.Select(o => o.Block)],
            OutputComponents = [.. outputs.Select(o => o.Component)],
        };
    }

    private static AccuracyContract Placeholder(int terms, int nk) => new()
    {
        Source = "none",
        P50 = new double[terms * nk],
        P90 = new double[terms * nk],
        P99 = new double[terms * nk],
        Max = new double[terms * nk],
        Relative = new bool[terms],
    };
}
