using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

/// <summary>
/// The textbook formulas of Rasmussen &amp; Williams (2006) written independently of the library, with explicit
/// dense inverses and determinants from MathNet: the referee of the Gaussian-process tests.
/// </summary>
internal sealed class DenseReference
{
    private readonly Matrix<double> _x;
    private readonly KernelKind _kernel;
    private readonly double _signal;
    private readonly double[] _lengths;
    private readonly double _noise;

    public DenseReference(Matrix<double> x, KernelKind kernel, double signal, double[] lengths, double noise)
    {
        _x = x;
        _kernel = kernel;
        _signal = signal;
        _lengths = lengths;
        _noise = noise;
    }

    /// <summary>R&amp;W eq. 4.9 with ARD distance (squared exponential) or eq. 4.17 with ν = 5/2 (Matérn).</summary>
    public double K(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double r2 = 0.0;
        for (int q = 0; q < a.Length; q++)
        {
            r2 += Math.Pow((a[q] - b[q]) / _lengths[q], 2);
        }

        double r = Math.Sqrt(r2);
        return _kernel == KernelKind.SquaredExponential
            ? _signal * Math.Exp(-r2 / 2.0)
            : _signal * (1.0 + (Math.Sqrt(5.0) * r) + (5.0 * r2 / 3.0)) * Math.Exp(-Math.Sqrt(5.0) * r);
    }

    /// <summary>K(X, X) + σ_n² I.</summary>
    public Matrix<double> Covariance() => Matrix<double>.Build.Dense(
        _x.RowCount, _x.RowCount, (a, b) => K(Designs.Row(_x, a), Designs.Row(_x, b)) + (a == b ? _noise : 0.0));

    public Vector<double> KStar(double[] point) =>
        Vector<double>.Build.Dense(_x.RowCount, i => K(point, Designs.Row(_x, i)));

    /// <summary>R&amp;W eq. 2.25: f̄* = k*ᵀ (K + σ_n²I)⁻¹ y, with an explicit inverse.</summary>
    public double Mean(double[] point, Vector<double> y) => KStar(point) * Covariance().Inverse() * y;

    /// <summary>R&amp;W eq. 2.26: V[f*] = k(x*, x*) − k*ᵀ (K + σ_n²I)⁻¹ k*, with an explicit inverse.</summary>
    public double Variance(double[] point)
    {
        var k = KStar(point);
        return K(point, point) - (k * Covariance().Inverse() * k);
    }

    /// <summary>R&amp;W eq. 2.30: −½ yᵀK⁻¹y − ½ ln|K| − (n/2) ln 2π, with a dense determinant.</summary>
    public double LogMarginalLikelihood(Vector<double> y)
    {
        var covariance = Covariance();
        return (-0.5 * (y * covariance.Inverse() * y)) - (0.5 * Math.Log(covariance.Determinant()))
            - (0.5 * y.Count * Math.Log(2.0 * Math.PI));
    }

    /// <summary>(y − mean)/rms deviation, the standardization the library documents.</summary>
    public static Vector<double> Standardize(Vector<double> y, out double mean, out double scale)
    {
        mean = y.Average();
        double centre = mean;
        scale = Math.Sqrt(y.Select(v => (v - centre) * (v - centre)).Average());
        return (y - mean) / scale;
    }
}
