using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Perturbation.Kernels;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.Kernels;

public class MatterKernelsTests
{
    private static readonly MatterKernels Eds = new(TimeCoefficientSolver.Solve(new ExpansionHistory(1.0), GeneralRelativity.Instance, 1.0));

    public static TheoryData<double[]> Triples => new()
    {
        new[] { 0.1, 0.0, 0.0, 0.03, 0.07, -0.02, -0.05, 0.01, 0.09 },
        new[] { 0.2, 0.1, -0.3, 0.5, 0.05, 0.02, -0.01, -0.4, 0.3 },
        new[] { 0.01, 0.02, 0.03, 1.0, -0.5, 0.2, -0.2, 0.1, 0.05 },
    };

    [Theory]
    [MemberData(nameof(Triples))]
    public void Einstein_de_Sitter_kernels_equal_the_standard_recursion(double[] v)
    {
        // Goroff, Grinstein, Rey & Wise (1986, ApJ 311, 6) / Jain & Bertschinger (1994, ApJ 431, 495)
        // recursion for F_n, G_n in EdS, coded independently below; V_n = f G_n with f = 1.
        // Agreement to 1e-6 (the RK4 error on the EdS coefficients is ~1e-7).
        var k1 = new Wavevector(v[0], v[1], v[2]);
        var k2 = new Wavevector(v[3], v[4], v[5]);
        var k3 = new Wavevector(v[6], v[7], v[8]);

        Assert.Equal(EdsRecursion.Symmetric(2, [k1, k2]).F, Eds.F2(k1, k2), 1e-6);
        Assert.Equal(EdsRecursion.Symmetric(2, [k1, k2]).G, Eds.V2(k1, k2), 1e-6);
        Assert.Equal(EdsRecursion.Symmetric(3, [k1, k2, k3]).F, Eds.F3(k1, k2, k3), 1e-6);
        Assert.Equal(EdsRecursion.Symmetric(3, [k1, k2, k3]).G, Eds.V3(k1, k2, k3), 1e-6);
    }

    [Fact]
    public void Third_order_kernel_is_finite_in_the_P13_configuration()
    {
        // F3(k, q, −q) is finite (the permutation with q + (−q) = 0 contributes nothing): compare with the
        // recursion, which avoids that permutation's 0/0 the same way.
        var k = new Wavevector(0.1, 0.0, 0.0);
        var q = new Wavevector(0.03, 0.04, -0.02);

        double f3 = Eds.F3(k, q, -q);

        Assert.True(double.IsFinite(f3));
        Assert.Equal(EdsRecursion.Symmetric(3, [k, q, -q]).F, f3, 1e-6);
    }

    /// <summary>The EdS recursion relations, unsymmetrised then averaged over permutations.</summary>
    private static class EdsRecursion
    {
        public static (double F, double G) Symmetric(int n, Wavevector[] k)
        {
            var permutations = Permutations(k).ToList();
            double f = 0, g = 0;
            foreach (var p in permutations)
            {
                var (fp, gp) = Unsymmetric(p);
                f += fp;
                g += gp;
            }

            return (f / permutations.Count, g / permutations.Count);
        }

        private static (double F, double G) Unsymmetric(Wavevector[] q)
        {
            int n = q.Length;
            if (n == 1)
            {
                return (1.0, 1.0);
            }

            double f = 0, g = 0;
            for (int m = 1; m < n; m++)
            {
                var left = q[..m];
                var right = q[m..];
                var k1 = Sum(left);
                var k2 = Sum(right);
                if (k1.LengthSquared < 1e-30 || k2.LengthSquared < 1e-30)
                {
                    continue;
                }

                var (_, gm) = Unsymmetric(left);
                var (fr, gr) = Unsymmetric(right);
                double alpha = ModeCouplingReference.Alpha(k1, k2);
                double beta = ModeCouplingReference.Beta(k1, k2);
                double norm = (2.0 * n + 3.0) * (n - 1.0);
                f += gm / norm * ((2.0 * n + 1.0) * alpha * fr + 2.0 * beta * gr);
                g += gm / norm * (3.0 * alpha * fr + 2.0 * n * beta * gr);
            }

            return (f, g);
        }

        private static Wavevector Sum(Wavevector[] q) => q.Aggregate(new Wavevector(0, 0, 0), (a, b) => a + b);

        private static IEnumerable<Wavevector[]> Permutations(Wavevector[] items)
        {
            if (items.Length <= 1)
            {
                yield return items;
                yield break;
            }

            for (int i = 0; i < items.Length; i++)
            {
                var rest = items.Where((_, j) => j != i).ToArray();
                foreach (var p in Permutations(rest))
                {
                    yield return [items[i], .. p];
                }
            }
        }
    }

    /// <summary>α and β written out again from Bernardeau et al. 2002 eq. 39, so the check does not reuse ModeCoupling.</summary>
    private static class ModeCouplingReference
    {
        public static double Alpha(Wavevector k1, Wavevector k2) =>
            ((k1.X + k2.X) * k1.X + (k1.Y + k2.Y) * k1.Y + (k1.Z + k2.Z) * k1.Z) / (k1.X * k1.X + k1.Y * k1.Y + k1.Z * k1.Z);

        public static double Beta(Wavevector k1, Wavevector k2)
        {
            double k12 = Math.Pow(k1.X + k2.X, 2) + Math.Pow(k1.Y + k2.Y, 2) + Math.Pow(k1.Z + k2.Z, 2);
            double dot = k1.X * k2.X + k1.Y * k2.Y + k1.Z * k2.Z;
            return k12 * dot / (2.0 * (k1.X * k1.X + k1.Y * k1.Y + k1.Z * k1.Z) * (k2.X * k2.X + k2.Y * k2.Y + k2.Z * k2.Z));
        }
    }
}
