using System.Numerics;
using System.Runtime.InteropServices;

namespace Sibyl.Emulation;

/// <summary>
/// The two loops every hot path here reduces to, written once with <see cref="Vector{T}"/> so that they use
/// the widest SIMD registers the machine has. Callers guarantee equal lengths.
/// </summary>
internal static class SpanArithmetic
{
    /// <summary>Σ a_i b_i.</summary>
    public static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int width = Vector<double>.Count;
        var va = MemoryMarshal.Cast<double, Vector<double>>(a);
        var vb = MemoryMarshal.Cast<double, Vector<double>>(b);
        // Four accumulators hide the latency of the fused multiply-add.
        Vector<double> s0 = Vector<double>.Zero, s1 = s0, s2 = s0, s3 = s0;
        int v = 0;
        for (; v + 3 < va.Length; v += 4)
        {
            s0 = Vector.FusedMultiplyAdd(va[v], vb[v], s0);
            s1 = Vector.FusedMultiplyAdd(va[v + 1], vb[v + 1], s1);
            s2 = Vector.FusedMultiplyAdd(va[v + 2], vb[v + 2], s2);
            s3 = Vector.FusedMultiplyAdd(va[v + 3], vb[v + 3], s3);
        }

        for (; v < va.Length; v++)
        {
            s0 = Vector.FusedMultiplyAdd(va[v], vb[v], s0);
        }

        double sum = Vector.Sum((s0 + s1) + (s2 + s3));
        for (int i = va.Length * width; i < a.Length; i++)
        {
            sum += a[i] * b[i];
        }

        return sum;
    }

    /// <summary>y_i += c x_i.</summary>
    public static void AddScaled(double c, ReadOnlySpan<double> x, Span<double> y)
    {
        int width = Vector<double>.Count;
        var vx = MemoryMarshal.Cast<double, Vector<double>>(x);
        var vy = MemoryMarshal.Cast<double, Vector<double>>(y);
        var vc = new Vector<double>(c);
        for (int v = 0; v < vx.Length; v++)
        {
            vy[v] = Vector.FusedMultiplyAdd(vc, vx[v], vy[v]);
        }

        for (int i = vx.Length * width; i < x.Length; i++)
        {
            y[i] += c * x[i];
        }
    }
}
