using System.Numerics;
using System.Runtime.InteropServices;

namespace Sibyl.Perturbation.Loops;

/// <summary>SIMD dot products of a weight row with one or two spectra (the only arithmetic of a cosmology evaluation).</summary>
internal static class VectorDot
{
    /// <summary>Σ x_i y_i over x's length; y must be at least as long.</summary>
    public static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length;
        var sum = Vector<double>.Zero;
        ReadOnlySpan<Vector<double>> xv = MemoryMarshal.Cast<double, Vector<double>>(x);
        ReadOnlySpan<Vector<double>> yv = MemoryMarshal.Cast<double, Vector<double>>(y[..n]);
        for (int v = 0; v < xv.Length; v++)
        {
            sum += xv[v] * yv[v];
        }

        double total = Vector.Sum(sum);
        for (int i = xv.Length * Vector<double>.Count; i < n; i++)
        {
            total += x[i] * y[i];
        }

        return total;
    }

    /// <summary>(Σ x_i y_i, Σ x_i z_i) in one pass over x.</summary>
    public static (double First, double Second) Dot2(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z)
    {
        int n = x.Length;
        var sumY = Vector<double>.Zero;
        var sumZ = Vector<double>.Zero;
        ReadOnlySpan<Vector<double>> xv = MemoryMarshal.Cast<double, Vector<double>>(x);
        ReadOnlySpan<Vector<double>> yv = MemoryMarshal.Cast<double, Vector<double>>(y[..n]);
        ReadOnlySpan<Vector<double>> zv = MemoryMarshal.Cast<double, Vector<double>>(z[..n]);
        for (int v = 0; v < xv.Length; v++)
        {
            sumY += xv[v] * yv[v];
            sumZ += xv[v] * zv[v];
        }

        double totalY = Vector.Sum(sumY);
        double totalZ = Vector.Sum(sumZ);
        for (int i = xv.Length * Vector<double>.Count; i < n; i++)
        {
            totalY += x[i] * y[i];
            totalZ += x[i] * z[i];
        }

        return (totalY, totalZ);
    }
}
