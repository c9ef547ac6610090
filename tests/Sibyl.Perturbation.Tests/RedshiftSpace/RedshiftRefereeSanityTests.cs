using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Perturbation.Tests.Loops;
using Xunit.Abstractions;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>The redshift-space referee itself, checked against the independent real-space referee.</summary>
public sealed class RedshiftRefereeSanityTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(RedshiftP22Structure.AlphaS, RedshiftP22Structure.AlphaS, P22Structure.AlphaAlpha)]
    [InlineData(RedshiftP22Structure.AlphaS, RedshiftP22Structure.Gamma, P22Structure.AlphaGamma)]
    public void Full_domain_vector_referee_reproduces_the_real_space_half_domain_referee(
        RedshiftP22Structure a,
        RedshiftP22Structure b,
        P22Structure realSpace)
    {
        // The redshift-space referee integrates 3-D vectors over all q in (ln q, x, φ); the Loops referee integrates
        // the literal α_s, γ over the half-domain p ≥ q in (ln q, x) (the real-space referee, independent code).
        // For μ-independent structures they must agree for any μ. Tolerance 1e-5: both are adaptive to ≲ 1e-6, and the
        // Loops referee integrates the 2048-node table (≲ 1e-7 from the analytic P for this smooth spectrum).
        var spectrum = new LogSampledSpectrum(InventedWigglySpectrum.Evaluate);
        const double k = 0.1;
        double vector = new RedshiftBruteForceReferee(InventedWigglySpectrum.Evaluate, spectrum.QMin, spectrum.QMax).Integral(a, b, k, 0.6);
        double half = new BruteForceReferee(spectrum).P22(k)[(int)realSpace];
        output.WriteLine($"{a}×{b}: vector referee {vector:R}, real-space referee {half:R}, relative {Math.Abs(vector / half - 1.0):E2}");
        Assert.Equal(half, vector, Math.Abs(half) * 1e-5);
    }
}
