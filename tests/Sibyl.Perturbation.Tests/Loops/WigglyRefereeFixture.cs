using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>
/// Computes once, for the invented wiggly spectrum, the fast plan's and the referee's nine integrals at the
/// checked wavenumbers (the referee costs seconds, so it is shared by all assertions).
/// </summary>
public sealed class WigglyRefereeFixture
{
    /// <summary>Checked wavenumbers, h/Mpc: the 0.005–0.5 accuracy band plus 1 h/Mpc for the usable band.</summary>
    public static readonly double[] K = [0.01, 0.05, 0.1, 0.2, 0.35, 0.5, 1.0];

    public WigglyRefereeFixture()
    {
        var spectrum = new LogSampledSpectrum(InventedSpectra.Wiggly);
        var plan = new LoopQuadrature(K);
        Fast = new MomentumIntegrals(K.Length);
        plan.Compute(spectrum, Fast);
        var referee = new BruteForceReferee(spectrum);
        P13Referee = new double[6, K.Length];
        P22Referee = new double[3, K.Length];
        for (int i = 0; i < K.Length; i++)
        {
            for (int s = 0; s < 6; s++)
            {
                P13Referee[s, i] = referee.P13((P13Structure)s, K[i]);
            }

            double[] p22 = referee.P22(K[i]);
            for (int s = 0; s < 3; s++)
            {
                P22Referee[s, i] = p22[s];
            }
        }
    }

    public MomentumIntegrals Fast { get; }

    public double[,] P13Referee { get; }

    public double[,] P22Referee { get; }
}
