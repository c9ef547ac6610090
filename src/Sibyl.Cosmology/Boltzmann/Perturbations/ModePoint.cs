namespace Sibyl.Cosmology.Boltzmann.Perturbations;

/// <summary>Background and thermal quantities at one instant, all in Mpc units with c = 1.</summary>
/// <param name="ScaleFactor">a.</param>
/// <param name="ConformalHubble">𝓗 = a'/a in 1/Mpc.</param>
/// <param name="ConformalHubbleDerivative">𝓗' = d𝓗/dτ in 1/Mpc².</param>
/// <param name="Time">Conformal time τ in Mpc.</param>
/// <param name="Opacity">κ' = a n_e σ_T in 1/Mpc.</param>
/// <param name="OpacityLogSlope">d ln κ' / d ln a.</param>
/// <param name="BaryonSoundSpeedSquared">c_s² of the baryon fluid.</param>
public readonly record struct ModePoint(
    double ScaleFactor,
    double ConformalHubble,
    double ConformalHubbleDerivative,
    double Time,
    double Opacity,
    double OpacityLogSlope,
    double BaryonSoundSpeedSquared);
