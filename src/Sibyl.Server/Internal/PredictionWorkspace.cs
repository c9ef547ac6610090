using Sibyl.Emulation.Emulators;

namespace Sibyl.Server.Internal;

/// <summary>
/// One thread's predictor and buffers for one emulator, so that a request allocates nothing but its reply. Buffers
/// for requested k values grow to the largest request seen (bounded by the server's k limit).
/// </summary>
internal sealed class PredictionWorkspace
{
    public PredictionWorkspace(SpectrumEmulator emulator)
    {
        int d = emulator.ParameterNames.Count, nk = emulator.K.Count, terms = emulator.Layout.Terms.Count;
        Predictor = emulator.CreatePredictor();
        Parameters = new double[d];
        Nuisance = new double[emulator.Layout.Nuisance.Count];
        Coefficients = new double[terms];
        SquaredCoefficients = new double[terms];
        Values = new double[terms * nk];
        Variance = new double[terms * nk];
        Gradient = new double[terms * nk * d];
        Knots = new double[nk];
        Curvature = new double[nk];
        EnsureOutput(nk, d, terms);
    }

    public EmulatorPredictor Predictor { get; }

    /// <summary>Input parameters in the emulator's order.</summary>
    public double[] Parameters { get; }

    /// <summary>Nuisance values in layout order (0 where the request gave none).</summary>
    public double[] Nuisance { get; }

    /// <summary>Each term's coefficient for the request's nuisance values.</summary>
    public double[] Coefficients { get; }

    /// <summary>Their squares, for the variances of observables.</summary>
    public double[] SquaredCoefficients { get; }

    /// <summary>The emulator's output on its own grid: terms × nk, and the variance and gradient in its layouts.</summary>
    public double[] Values { get; }

    public double[] Variance { get; }

    public double[] Gradient { get; }

    /// <summary>Spline scratch: one series at the knots, and its second derivatives.</summary>
    public double[] Knots { get; }

    public double[] Curvature { get; }

    /// <summary>Where each requested k falls on the spline.</summary>
    public SplinePoint[] Points { get; private set; } = [];

    /// <summary>Terms interpolated to the requested k: terms × count, and variance and gradient likewise.</summary>
    public double[] OutValues { get; private set; } = [];

    public double[] OutVariance { get; private set; } = [];

    public double[] OutGradient { get; private set; } = [];

    /// <summary>One series over the output k (an observable being summed, or a spline's result).</summary>
    public double[] Column { get; private set; } = [];

    /// <summary>Column's counterpart for gradients (count × d).</summary>
    public double[] GradientColumn { get; private set; } = [];

    /// <summary>Makes the output buffers hold <paramref name="count"/> k values.</summary>
    public void EnsureOutput(int count, int d, int terms)
    {
        if (Column.Length >= count)
        {
            return;
        }

        Points = new SplinePoint[count];
        OutValues = new double[terms * count];
        OutVariance = new double[terms * count];
        OutGradient = new double[terms * count * d];
        Column = new double[count];
        GradientColumn = new double[count * d];
    }
}
