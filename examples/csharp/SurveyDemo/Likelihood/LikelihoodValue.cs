namespace Sibyl.Demo.Likelihood;

/// <summary>One evaluation of <see cref="MultipoleLikelihood"/>.</summary>
/// <param name="MinusTwoLnL">−2 ln L with the linear nuisance parameters integrated out, up to a theory-independent constant.</param>
/// <param name="Chi2">χ² of the data against the model with the marginalised parameters at their conditional posterior mean.</param>
/// <param name="LinearMean">Conditional posterior mean F⁻¹b of the marginalised parameters, in the scenario's order.</param>
public sealed record LikelihoodValue(double MinusTwoLnL, double Chi2, double[] LinearMean);
