namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>
/// One step of BDF2, y_{n+1} − (4/3) y_n + (1/3) y_{n−1} = (2/3) h f(y_{n+1}), for the three recombination
/// variables, solved by a simplified Newton iteration: the matrix I − (2/3) h J, J by finite differences, is
/// factored only when the iteration slows down, since J changes by well under 1 % per step of 1e-3 in ln a and
/// the right-hand sides dominate the cost. The scratch arrays are made once, so stepping allocates nothing.
/// </summary>
internal sealed class Bdf2Stepper
{
    private const int Size = RecombinationRates.Dimension;
    private const int MaximumIterations = 30;

    /// <summary>Iterations after which a step refreshes the matrix (within the step and for the next one).</summary>
    private const int SlowIterations = 3;

    /// <summary>Convergence: each Newton update below this times the variable's magnitude (or floor).</summary>
    private const double RelativeTolerance = 1e-10;

    /// <summary>Magnitude floor of the neutral fractions, far below any that matters for the opacity or the rates.</summary>
    private const double FractionFloor = 1e-20;

    private readonly RecombinationRates _rates;
    private readonly double _heliumRatio;
    private double[] _older = new double[Size], _previous = new double[Size], _current = new double[Size];
    private readonly double[] _state = new double[Size], _constant = new double[Size], _derivative = new double[Size];
    private readonly double[] _shifted = new double[Size], _shiftedDerivative = new double[Size], _residual = new double[Size];
    private readonly double[,] _matrix = new double[Size, Size];
    private readonly int[] _pivot = new int[Size];
    private double _factoredGamma = double.NaN;
    private int _history;

    /// <param name="rates">Right-hand sides; their epoch is set by the caller to t_{n+1} before each step.</param>
    /// <param name="heliumRatio">f_He, the upper bound of n_HeI/n_H.</param>
    public Bdf2Stepper(RecombinationRates rates, double heliumRatio)
    {
        _rates = rates;
        _heliumRatio = heliumRatio;
    }

    /// <summary>The state y_n after the last step.</summary>
    public ReadOnlySpan<double> State => _current;

    /// <summary>f(y_n) at the last Newton iterate, within the Newton tolerance of f at <see cref="State"/>.</summary>
    public ReadOnlySpan<double> Derivative => _derivative;

    /// <summary>Starts from two consecutive states y_{n−1} and y_n one step apart.</summary>
    public void Start(ReadOnlySpan<double> previous, ReadOnlySpan<double> current)
    {
        previous.CopyTo(_previous);
        current.CopyTo(_current);
        _history = 2;
    }

    /// <summary>Advances the state by <paramref name="step"/> in ln a (the step of <see cref="Start"/>).</summary>
    /// <exception cref="InvalidOperationException">Newton's method did not converge (a bug, not a property of the input).</exception>
    public void Step(double step)
    {
        double gamma = 2.0 / 3.0 * step;
        for (int i = 0; i < Size; i++)
        {
            _constant[i] = (4.0 * _current[i] - _previous[i]) / 3.0;

            // Quadratic extrapolation once three states are known: its O(h³) error lets the iteration
            // converge in about two right-hand sides.
            _state[i] = _history >= 3
                ? 3.0 * (_current[i] - _previous[i]) + _older[i]
                : 2.0 * _current[i] - _previous[i];
        }

        Clamp(_state);
        bool fresh = false;
        if (_factoredGamma != gamma)
        {
            FactorIterationMatrix(gamma);
            fresh = true;
        }

        for (int iteration = 0; iteration < MaximumIterations; iteration++)
        {
            if (iteration == SlowIterations && !fresh)
            {
                FactorIterationMatrix(gamma);
                fresh = true;
            }

            _rates.Evaluate(_state, _derivative);
            for (int i = 0; i < Size; i++)
            {
                _residual[i] = _constant[i] + gamma * _derivative[i] - _state[i];
            }

            SolveFactored(_residual);
            bool converged = true;
            for (int i = 0; i < Size; i++)
            {
                double scale = Math.Max(Math.Abs(_state[i]), i == 2 ? 1.0 : FractionFloor);
                converged &= Math.Abs(_residual[i]) <= RelativeTolerance * scale;
                _state[i] += _residual[i];
            }

            Clamp(_state);
            if (converged)
            {
                if (iteration >= SlowIterations)
                {
                    _factoredGamma = double.NaN;
                }

                (_older, _previous, _current) = (_previous, _current, _older);
                _state.CopyTo(_current, 0);
                _history++;
                return;
            }
        }

        throw new InvalidOperationException("BDF2 Newton iteration of the recombination equations did not converge");
    }

    /// <summary>Forms and LU-factors I − γ J at the current iterate, J by one-sided differences.</summary>
    private void FactorIterationMatrix(double gamma)
    {
        _factoredGamma = gamma;
        _rates.Evaluate(_state, _derivative);
        for (int j = 0; j < Size; j++)
        {
            _state.CopyTo(_shifted, 0);
            double delta = 1e-7 * Math.Max(Math.Abs(_state[j]), j == 2 ? 1.0 : FractionFloor);

            // Step inwards at the upper bounds so that the rates stay in their physical domain.
            if ((j == 0 && _state[0] + delta > 1.0) || (j == 1 && _state[1] + delta > _heliumRatio))
            {
                delta = -delta;
            }

            _shifted[j] += delta;
            _rates.Evaluate(_shifted, _shiftedDerivative);
            for (int i = 0; i < Size; i++)
            {
                _matrix[i, j] = (i == j ? 1.0 : 0.0) - gamma * (_shiftedDerivative[i] - _derivative[i]) / delta;
            }
        }

        for (int k = 0; k < Size; k++)
        {
            int pivot = k;
            for (int i = k + 1; i < Size; i++)
            {
                if (Math.Abs(_matrix[i, k]) > Math.Abs(_matrix[pivot, k]))
                {
                    pivot = i;
                }
            }

            _pivot[k] = pivot;
            if (pivot != k)
            {
                for (int j = 0; j < Size; j++)
                {
                    (_matrix[k, j], _matrix[pivot, j]) = (_matrix[pivot, j], _matrix[k, j]);
                }
            }

            for (int i = k + 1; i < Size; i++)
            {
                double factor = _matrix[i, k] /= _matrix[k, k];
                for (int j = k + 1; j < Size; j++)
                {
                    _matrix[i, j] -= factor * _matrix[k, j];
                }
            }
        }
    }

    /// <summary>Overwrites <paramref name="vector"/> with the solution of the factored system.</summary>
    private void SolveFactored(double[] vector)
    {
        // Whole rows (multipliers included) were swapped during factoring, so all swaps come first.
        for (int k = 0; k < Size; k++)
        {
            (vector[k], vector[_pivot[k]]) = (vector[_pivot[k]], vector[k]);
        }

        for (int k = 0; k < Size; k++)
        {
            for (int i = k + 1; i < Size; i++)
            {
                vector[i] -= _matrix[i, k] * vector[k];
            }
        }

        for (int i = Size - 1; i >= 0; i--)
        {
            double sum = vector[i];
            for (int j = i + 1; j < Size; j++)
            {
                sum -= _matrix[i, j] * vector[j];
            }

            vector[i] = sum / _matrix[i, i];
        }
    }

    private void Clamp(double[] state)
    {
        state[0] = Math.Clamp(state[0], 0.0, 1.0);
        state[1] = Math.Clamp(state[1], 0.0, _heliumRatio);
        state[2] = Math.Max(state[2], 0.0);
    }
}
