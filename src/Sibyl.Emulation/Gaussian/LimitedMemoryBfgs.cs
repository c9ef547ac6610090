namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Limited-memory BFGS minimisation (Nocedal &amp; Wright 2006, "Numerical Optimization", 2nd ed., Springer,
/// Algorithm 7.4 two-loop recursion and Algorithm 7.5) with a backtracking Armijo line search. Pairs that violate
/// the curvature condition sᵀy &gt; 0 are skipped, which keeps the implied Hessian positive definite without a Wolfe
/// search. The objective may return +∞ (or NaN) where it is undefined; the line search then shortens the step.
/// It never raises on non-convergence: it returns the best point found, which is what a restarted fit needs.
/// </summary>
internal sealed class LimitedMemoryBfgs(int memory = 8, double gradientTolerance = 1e-5, double relativeTolerance = 1e-10)
{
    private const double Armijo = 1e-4;
    private const int MaximumHalvings = 40;

    /// <summary>Objective: returns f(x) and writes ∇f(x) into the span.</summary>
    public delegate double Objective(ReadOnlySpan<double> x, Span<double> gradient);

    /// <summary>Minimises <paramref name="objective"/> from <paramref name="start"/>; returns the best x, f(x) and the iterations used.</summary>
    public (double[] X, double Value, int Iterations) Minimize(Objective objective, ReadOnlySpan<double> start, int maximumIterations)
    {
        int size = start.Length;
        double[] x = start.ToArray(), g = new double[size];
        double f = objective(x, g);
        if (!double.IsFinite(f))
        {
            return (x, f, 0);
        }

        var s = new double[memory][];
        var y = new double[memory][];
        var rho = new double[memory];
        var alphas = new double[memory];
        for (int i = 0; i < memory; i++)
        {
            s[i] = new double[size];
            y[i] = new double[size];
        }

        double[] direction = new double[size], trial = new double[size], trialGradient = new double[size];
        int stored = 0, newest = -1, iteration = 0;
        while (iteration < maximumIterations && MaxAbs(g) > gradientTolerance)
        {
            iteration++;
            TwoLoop(g, s, y, rho, alphas, stored, newest, direction);
            double slope = Dot(g, direction);
            if (!(slope < 0.0))
            {
                // Not a descent direction (the memory is stale): forget it and go downhill.
                stored = 0;
                SteepestDescent(g, direction);
                slope = Dot(g, direction);
            }

            double step = 1.0, trialValue = double.NaN;
            bool accepted = false;
            for (int halving = 0; halving < MaximumHalvings; halving++)
            {
                for (int i = 0; i < size; i++)
                {
                    trial[i] = x[i] + (step * direction[i]);
                }

                trialValue = objective(trial, trialGradient);
                if (double.IsFinite(trialValue) && trialValue <= f + (Armijo * step * slope))
                {
                    accepted = true;
                    break;
                }

                step *= 0.5;
            }

            if (!accepted)
            {
                if (stored == 0)
                {
                    break;
                }

                // A failed search along a quasi-Newton direction: retry once along steepest descent.
                stored = 0;
                continue;
            }

            double sy = 0.0, yy = 0.0;
            for (int i = 0; i < size; i++)
            {
                double si = trial[i] - x[i], yi = trialGradient[i] - g[i];
                sy += si * yi;
                yy += yi * yi;
            }

            if (sy > 1e-12 * yy && sy > 0.0)
            {
                newest = (newest + 1) % memory;
                for (int i = 0; i < size; i++)
                {
                    s[newest][i] = trial[i] - x[i];
                    y[newest][i] = trialGradient[i] - g[i];
                }

                rho[newest] = 1.0 / sy;
                stored = Math.Min(stored + 1, memory);
            }

            double change = f - trialValue;
            Array.Copy(trial, x, size);
            Array.Copy(trialGradient, g, size);
            f = trialValue;
            if (change <= relativeTolerance * Math.Max(1.0, Math.Abs(f)))
            {
                break;
            }
        }

        return (x, f, iteration);
    }

    /// <summary>direction = −H g with H the L-BFGS inverse-Hessian estimate (Nocedal &amp; Wright Algorithm 7.4).</summary>
    private static void TwoLoop(double[] g, double[][] s, double[][] y, double[] rho, double[] alphas, int stored, int newest, double[] direction)
    {
        if (stored == 0)
        {
            SteepestDescent(g, direction);
            return;
        }

        int memory = rho.Length;
        Array.Copy(g, direction, g.Length);
        for (int k = 0; k < stored; k++)
        {
            int i = (newest - k + memory) % memory;
            alphas[i] = rho[i] * Dot(s[i], direction);
            AddScaled(-alphas[i], y[i], direction);
        }

        // Initial scaling γ = sᵀy / yᵀy of the newest pair (Nocedal & Wright eq. 7.20).
        double gamma = 1.0 / (rho[newest] * Dot(y[newest], y[newest]));
        for (int i = 0; i < direction.Length; i++)
        {
            direction[i] *= gamma;
        }

        for (int k = stored - 1; k >= 0; k--)
        {
            int i = (newest - k + memory) % memory;
            double beta = rho[i] * Dot(y[i], direction);
            AddScaled(alphas[i] - beta, s[i], direction);
        }

        for (int i = 0; i < direction.Length; i++)
        {
            direction[i] = -direction[i];
        }
    }

    /// <summary>A steepest-descent step no longer than 1 in any coordinate, so the first trial stays near the start.</summary>
    private static void SteepestDescent(double[] g, double[] direction)
    {
        double scale = 1.0 / Math.Max(1.0, MaxAbs(g));
        for (int i = 0; i < g.Length; i++)
        {
            direction[i] = -scale * g[i];
        }
    }

    private static double Dot(double[] a, double[] b) => SpanArithmetic.Dot(a, b);

    private static void AddScaled(double c, double[] x, double[] y) => SpanArithmetic.AddScaled(c, x, y);

    private static double MaxAbs(double[] values)
    {
        double max = 0.0;
        foreach (double v in values)
        {
            max = Math.Max(max, Math.Abs(v));
        }

        return max;
    }
}
