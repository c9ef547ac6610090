namespace Sibyl.Demo.Survey;

/// <summary>A Gaussian prior N(mean, sigma²) on a nuisance parameter the observables are linear in.</summary>
/// <param name="Name">Name in the galaxy basis (for example c0).</param>
/// <param name="Mean">Prior mean, in the parameter's units.</param>
/// <param name="Sigma">Prior standard deviation, positive.</param>
public sealed record GaussianPrior(string Name, double Mean, double Sigma);
