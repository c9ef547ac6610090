using Sibyl.Cosmology.Boltzmann.Recombination;

namespace Sibyl.Cosmology.Boltzmann.Perturbations;

/// <summary>
/// Everything the mode equations read from the background and the thermal history, tabulated once per cosmology
/// on a uniform grid in ln a so that the right-hand side (called ~10⁶ times per spectrum) does one O(1) linear
/// interpolation. At spacing 5e-4 in ln a the interpolation error is below 1e-7 for the smooth background and
/// below 1e-5 across recombination, where x_e changes on a scale of 0.05 in ln a.
/// </summary>
public sealed class ModeBackground
{
    /// <summary>Smallest tabulated scale factor.</summary>
    public const double MinScaleFactor = 1e-9;

    private const double Step = 5e-4;
    private const int Fields = 6;
    private const int ConformalHubbleField = 0, ConformalHubbleSlopeField = 1, TimeField = 2, OpacityField = 3, OpacitySlopeField = 4, SoundSpeedField = 5;

    private readonly double _lnAMin;
    private readonly double[] _table;
    private readonly int _count;

    /// <summary>Tabulates <paramref name="background"/> and <paramref name="thermal"/>.</summary>
    public ModeBackground(RadiationBackground background, ThermalHistory thermal)
    {
        ArgumentNullException.ThrowIfNull(background);
        ArgumentNullException.ThrowIfNull(thermal);
        Background = background;
        _lnAMin = Math.Log(MinScaleFactor);
        _count = (int)Math.Ceiling(-_lnAMin / Step) + 2;
        _table = new double[_count * Fields];
        double previousInverse = 0.0, time = MinScaleFactor / (background.HubbleToday * Math.Sqrt(background.OmegaRadiation));
        for (int i = 0; i < _count; i++)
        {
            double lnA = _lnAMin + i * Step, a = Math.Exp(lnA);
            double conformalHubble = background.ConformalHubble(a);
            var row = _table.AsSpan(i * Fields, Fields);
            row[ConformalHubbleField] = conformalHubble;
            row[ConformalHubbleSlopeField] = background.ConformalHubbleDerivative(a);

            // dτ/d ln a = 1/𝓗, trapezoid rule; the radiation-era start is exact to O(a/a_eq) = 3e-6.
            if (i > 0)
            {
                time += 0.5 * Step * (previousInverse + 1.0 / conformalHubble);
            }

            previousInverse = 1.0 / conformalHubble;
            row[TimeField] = time;
            row[OpacityField] = thermal.Opacity(lnA);
            row[SoundSpeedField] = thermal.BaryonSoundSpeedSquared(lnA);
        }

        for (int i = 0; i < _count; i++)
        {
            int lo = Math.Max(i - 1, 0), hi = Math.Min(i + 1, _count - 1);
            _table[i * Fields + OpacitySlopeField] =
                Math.Log(_table[hi * Fields + OpacityField] / _table[lo * Fields + OpacityField]) / ((hi - lo) * Step);
        }
    }

    /// <summary>The background tabulated.</summary>
    public RadiationBackground Background { get; }

    /// <summary>R·a = 4ρ_γ/(3ρ_b)·a, the photon-to-baryon momentum ratio at a = 1.</summary>
    public double PhotonToBaryonToday => 4.0 / 3.0 * Background.OmegaPhoton / Background.OmegaBaryon;

    /// <summary>Smallest tabulated ln a.</summary>
    public double MinLnA => _lnAMin;

    /// <summary>Reads every field at <paramref name="lnA"/> into <paramref name="point"/>.</summary>
    public void At(double lnA, out ModePoint point)
    {
        double x = (lnA - _lnAMin) / Step;
        int i = Math.Clamp((int)x, 0, _count - 2);
        double f = x - i, g = 1.0 - f;
        int o = i * Fields;
        var t = _table;
        point = new ModePoint(
            Math.Exp(lnA),
            g * t[o] + f * t[o + Fields],
            g * t[o + 1] + f * t[o + 1 + Fields],
            g * t[o + 2] + f * t[o + 2 + Fields],
            g * t[o + 3] + f * t[o + 3 + Fields],
            g * t[o + 4] + f * t[o + 4 + Fields],
            g * t[o + 5] + f * t[o + 5 + Fields]);
    }

    /// <summary>
    /// The smallest ln a in [<paramref name="from"/>, 0] at which <paramref name="condition"/> holds, for a condition
    /// that stays true once it turns true; 0 when it never holds. Bisection on the table to 1e-6 in ln a.
    /// </summary>
    public double FirstWhere(Func<ModePoint, bool> condition, double from)
    {
        ArgumentNullException.ThrowIfNull(condition);
        At(from, out var start);
        if (condition(start))
        {
            return from;
        }

        At(0.0, out var end);
        if (!condition(end))
        {
            return 0.0;
        }

        double lo = from, hi = 0.0;
        while (hi - lo > 1e-6)
        {
            double mid = 0.5 * (lo + hi);
            At(mid, out var p);
            if (condition(p))
            {
                hi = mid;
            }
            else
            {
                lo = mid;
            }
        }

        return hi;
    }

    /// <summary>The ln a at which conformal time reaches <paramref name="time"/> Mpc (clamped to the table).</summary>
    public double LnAAtTime(double time) => FirstWhere(p => p.Time >= time, _lnAMin);
}
