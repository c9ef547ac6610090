namespace Sibyl.Cosmology.Linear;

/// <summary>
/// Matter transfer function with baryon acoustic oscillations of Eisenstein &amp; Hu (1998, ApJ 496, 605),
/// equation numbers as in that paper, with its zero-baryon ("no-wiggle") form of section 4.2.
/// Wavenumbers in this class are in 1/Mpc (not h/Mpc) and lengths in Mpc, as in the paper.
/// The fit is stated there to be good to a few per cent for 0.025 ≲ ω_m ≲ 0.5 and Ω_b/Ω_m ≲ 0.5.
/// </summary>
public sealed class EisensteinHu
{
    private readonly double _fb, _fc;
    private readonly double _kEq, _kSilk, _alphaC, _betaC, _alphaB, _betaB, _betaNode;
    private readonly double _alphaGamma, _omegaMatterH2;
    private readonly double _theta2;

    /// <summary>Computes the fitting-formula coefficients.</summary>
    /// <param name="omegaBaryon">ω_b = Ω_b h², in (0, 0.1].</param>
    /// <param name="omegaCdm">ω_cdm = Ω_c h², in (0, 1].</param>
    /// <param name="h">Dimensionless Hubble constant, in (0, 2].</param>
    /// <param name="cmbTemperature">T_CMB in K, default 2.7255.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is outside its range.</exception>
    public EisensteinHu(double omegaBaryon, double omegaCdm, double h, double cmbTemperature = 2.7255)
    {
        Require(omegaBaryon > 0.0 && omegaBaryon <= 0.1, nameof(omegaBaryon), omegaBaryon, "(0, 0.1]");
        Require(omegaCdm > 0.0 && omegaCdm <= 1.0, nameof(omegaCdm), omegaCdm, "(0, 1]");
        Require(h > 0.0 && h <= 2.0, nameof(h), h, "(0, 2]");
        Require(cmbTemperature > 1.0 && cmbTemperature < 4.0, nameof(cmbTemperature), cmbTemperature, "(1, 4) K");

        double theta = cmbTemperature / 2.7;
        _theta2 = theta * theta;
        double wb = omegaBaryon;
        double wm = omegaBaryon + omegaCdm;
        _fb = wb / wm;
        _fc = omegaCdm / wm;
        _omegaMatterH2 = wm;

        ZEquality = 2.50e4 * wm / (_theta2 * _theta2);                                      // eq. 2
        _kEq = 7.46e-2 * wm / _theta2;                                                      // eq. 3
        double b1 = 0.313 * Math.Pow(wm, -0.419) * (1.0 + 0.607 * Math.Pow(wm, 0.674));     // eq. 4
        double b2 = 0.238 * Math.Pow(wm, 0.223);
        ZDrag = 1291.0 * Math.Pow(wm, 0.251) / (1.0 + 0.659 * Math.Pow(wm, 0.828)) * (1.0 + b1 * Math.Pow(wb, b2));

        double rDrag = BaryonPhotonRatio(wb, ZDrag);
        double rEq = BaryonPhotonRatio(wb, ZEquality);
        SoundHorizon = 2.0 / (3.0 * _kEq) * Math.Sqrt(6.0 / rEq)                             // eq. 6
            * Math.Log((Math.Sqrt(1.0 + rDrag) + Math.Sqrt(rDrag + rEq)) / (1.0 + Math.Sqrt(rEq)));
        _kSilk = 1.6 * Math.Pow(wb, 0.52) * Math.Pow(wm, 0.73) * (1.0 + Math.Pow(10.4 * wm, -0.95)); // eq. 7

        double a1 = Math.Pow(46.9 * wm, 0.670) * (1.0 + Math.Pow(32.1 * wm, -0.532));        // eq. 11
        double a2 = Math.Pow(12.0 * wm, 0.424) * (1.0 + Math.Pow(45.0 * wm, -0.582));
        _alphaC = Math.Pow(a1, -_fb) * Math.Pow(a2, -_fb * _fb * _fb);
        double bb1 = 0.944 / (1.0 + Math.Pow(458.0 * wm, -0.708));                          // eq. 12
        double bb2 = Math.Pow(0.395 * wm, -0.0266);
        _betaC = 1.0 / (1.0 + bb1 * (Math.Pow(_fc, bb2) - 1.0));

        double y = (1.0 + ZEquality) / (1.0 + ZDrag);                                       // eq. 15
        double sq = Math.Sqrt(1.0 + y);
        double g = y * (-6.0 * sq + (2.0 + 3.0 * y) * Math.Log((sq + 1.0) / (sq - 1.0)));
        _alphaB = 2.07 * _kEq * SoundHorizon * Math.Pow(1.0 + rDrag, -0.75) * g;             // eq. 14
        _betaNode = 8.41 * Math.Pow(wm, 0.435);                                              // eq. 23
        _betaB = 0.5 + _fb + (3.0 - 2.0 * _fb) * Math.Sqrt(Math.Pow(17.2 * wm, 2) + 1.0);   // eq. 24

        _alphaGamma = 1.0 - 0.328 * Math.Log(431.0 * wm) * _fb + 0.38 * Math.Log(22.3 * wm) * _fb * _fb; // eq. 31
        ApproximateSoundHorizon = 44.5 * Math.Log(9.83 / wm) / Math.Sqrt(1.0 + 10.0 * Math.Pow(wb, 0.75)); // eq. 26
    }

    /// <summary>Redshift of matter–radiation equality, eq. 2.</summary>
    public double ZEquality { get; }

    /// <summary>Drag-epoch redshift z_d, eq. 4.</summary>
    public double ZDrag { get; }

    /// <summary>Sound horizon at the drag epoch in Mpc, eq. 6.</summary>
    public double SoundHorizon { get; }

    /// <summary>The paper's approximate sound horizon in Mpc, eq. 26.</summary>
    public double ApproximateSoundHorizon { get; }

    /// <summary>Full transfer function T(k) with baryon oscillations, eqs. 16–24; k in 1/Mpc.</summary>
    public double Transfer(double k)
    {
        double q = k / (13.41 * _kEq);                                                      // eq. 10
        double ks = k * SoundHorizon;

        double f = 1.0 / (1.0 + Math.Pow(ks / 5.4, 4));                                      // eq. 18
        double tc = f * PressurelessTransfer(q, 1.0, _betaC) + (1.0 - f) * PressurelessTransfer(q, _alphaC, _betaC); // eq. 17

        double sTilde = SoundHorizon / Math.Cbrt(1.0 + Math.Pow(_betaNode / ks, 3));         // eq. 22
        double x = k * sTilde;
        double j0 = x < 1e-4 ? 1.0 - x * x / 6.0 : Math.Sin(x) / x;
        double tb = (PressurelessTransfer(q, 1.0, 1.0) / (1.0 + Math.Pow(ks / 5.2, 2))      // eq. 21
                     + _alphaB / (1.0 + Math.Pow(_betaB / ks, 3)) * Math.Exp(-Math.Pow(k / _kSilk, 1.4))) * j0;

        return _fb * tb + _fc * tc;                                                          // eq. 16
    }

    /// <summary>Zero-baryon transfer function with the baryon suppression of the broadband, eqs. 28–31; k in 1/Mpc.</summary>
    public double NoWiggleTransfer(double k)
    {
        double ks = k * SoundHorizon;
        // Eq. 28 has k in h/Mpc over Γ_eff = Ω_m h (…); with k in 1/Mpc the h's combine into ω_m.
        double gammaEffH = _omegaMatterH2 * (_alphaGamma + (1.0 - _alphaGamma) / (1.0 + Math.Pow(0.43 * ks, 4))); // eq. 30
        double q = k * _theta2 / gammaEffH;
        double l0 = Math.Log(2.0 * Math.E + 1.8 * q);                                        // eq. 29
        double c0 = 14.2 + 731.0 / (1.0 + 62.5 * q);
        return l0 / (l0 + c0 * q * q);
    }

    private static double PressurelessTransfer(double q, double alphaC, double betaC)      // eqs. 19–20
    {
        double l = Math.Log(Math.E + 1.8 * betaC * q);
        double c = 14.2 / alphaC + 386.0 / (1.0 + 69.9 * Math.Pow(q, 1.08));
        return l / (l + c * q * q);
    }

    private double BaryonPhotonRatio(double omegaBaryon, double z) =>                       // eq. 5
        31.5 * omegaBaryon / (_theta2 * _theta2) * (1000.0 / z);

    private static void Require(bool ok, string name, double value, string range)
    {
        if (!ok)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must lie in {range}");
        }
    }
}
