namespace Sibyl.Emulation.Emulators;

/// <summary>How one basis term is mapped before compression, chosen per block from the training data.</summary>
public enum TargetTransform
{
    /// <summary>ln of the term: for terms positive at every training point and k. Amplitude and growth factors
    /// become additive, which shrinks the dynamic range the Gaussian processes must learn to a few units.</summary>
    Log,

    /// <summary>The term itself, divided per k by its root-mean-square over the training points: for terms that
    /// change sign or vanish somewhere.</summary>
    Linear,
}
