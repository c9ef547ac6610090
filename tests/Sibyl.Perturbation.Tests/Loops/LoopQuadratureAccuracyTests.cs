using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

public sealed class LoopQuadratureAccuracyTests(WigglyRefereeFixture fixture) : IClassFixture<WigglyRefereeFixture>
{
    // Brief's accuracy target for 0.005 ≤ k ≤ 0.5 h/Mpc on every integral, and the "usable" target up to 1 h/Mpc.
    // The referee is asked for 1e-8 relative, so it does not limit these comparisons.
    private const double BandTolerance = 1e-3;
    private const double UsableTolerance = 1e-2;

    public static TheoryData<int> P13Cases() => Cases(6);

    public static TheoryData<int> P22Cases() => Cases(3);

    [Theory]
    [MemberData(nameof(P13Cases))]
    public void Fast_P13_integrals_of_a_wiggly_spectrum_match_the_brute_force_referee(int structure)
    {
        for (int i = 0; i < WigglyRefereeFixture.K.Length; i++)
        {
            double k = WigglyRefereeFixture.K[i];
            double referee = fixture.P13Referee[structure, i];
            double fast = fixture.Fast[(P13Structure)structure][i];
            AssertClose(referee, fast, k, ((P13Structure)structure).ToString());
        }
    }

    [Theory]
    [MemberData(nameof(P22Cases))]
    public void Fast_P22_integrals_of_a_wiggly_spectrum_match_the_brute_force_referee(int structure)
    {
        for (int i = 0; i < WigglyRefereeFixture.K.Length; i++)
        {
            double k = WigglyRefereeFixture.K[i];
            double referee = fixture.P22Referee[structure, i];
            double fast = fixture.Fast[(P22Structure)structure][i];
            AssertClose(referee, fast, k, ((P22Structure)structure).ToString());
        }
    }

    private static void AssertClose(double referee, double fast, double k, string name)
    {
        double tolerance = k <= 0.5 ? BandTolerance : UsableTolerance;
        double relative = Math.Abs(fast / referee - 1.0);
        Assert.True(relative <= tolerance, FormattableString.Invariant($"{name} at k = {k}: fast {fast:R}, referee {referee:R}, relative error {relative:E2}"));
    }

    private static TheoryData<int> Cases(int count)
    {
        var data = new TheoryData<int>();
        for (int s = 0; s < count; s++)
        {
            data.Add(s);
        }

        return data;
    }
}
