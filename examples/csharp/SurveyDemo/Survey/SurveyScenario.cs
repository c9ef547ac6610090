using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace Sibyl.Demo.Survey;

/// <summary>
/// An invented survey scenario (examples/survey/scenario.json): one galaxy sample at one effective redshift, its
/// volume and number density (which set the Gaussian covariance), the k bins and multipoles of the data vector, the
/// hidden parameters the synthetic data are made from, and how the fit treats every nuisance parameter.
/// Nothing here describes a real survey.
/// </summary>
public sealed record SurveyScenario
{
    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
        ReadCommentHandling = JsonCommentHandling.Skip,
    };

    /// <summary>Name of the scenario.</summary>
    public required string Name { get; init; }

    /// <summary>Free text; says that the scenario is invented.</summary>
    public required string Description { get; init; }

    /// <summary>Effective redshift of the sample.</summary>
    public required double Redshift { get; init; }

    /// <summary>Survey volume in (Mpc/h)³.</summary>
    public required double Volume { get; init; }

    /// <summary>Number density n̄ in (h/Mpc)³; the Poisson shot noise is 1/n̄.</summary>
    public required double NumberDensity { get; init; }

    /// <summary>Linear k bins of the data vector, h/Mpc.</summary>
    public required KBins KBins { get; init; }

    /// <summary>Multipoles ℓ of the data vector, from {0, 2, 4}, increasing.</summary>
    public required int[] Multipoles { get; init; }

    /// <summary>Hidden values of the emulator box's cosmological parameters, by name.</summary>
    public required Dictionary<string, double> HiddenCosmology { get; init; }

    /// <summary>Hidden values of every nuisance parameter of the galaxy basis, by name.</summary>
    public required Dictionary<string, double> HiddenNuisance { get; init; }

    /// <summary>Nuisance parameters the sampler explores, with flat priors.</summary>
    public required SampledNuisance[] SampledNuisance { get; init; }

    /// <summary>Linear nuisance parameters integrated out analytically under Gaussian priors.</summary>
    public required GaussianPrior[] MarginalisedNuisance { get; init; }

    /// <summary>Seed of the noise drawn into the synthetic data.</summary>
    public required int NoiseSeed { get; init; }

    /// <summary>Poisson shot noise 1/n̄, (Mpc/h)³.</summary>
    public double ShotNoise => 1.0 / NumberDensity;

    /// <summary>Reads and checks a scenario file.</summary>
    /// <exception cref="InvalidDataException">The file is malformed or inconsistent; the message says what.</exception>
    public static SurveyScenario Load(string path)
    {
        SurveyScenario? scenario;
        try
        {
            scenario = JsonSerializer.Deserialize<SurveyScenario>(File.ReadAllText(path), Json);
        }
        catch (JsonException e)
        {
            throw new InvalidDataException($"{path}: {e.Message}", e);
        }

        if (scenario is null)
        {
            throw new InvalidDataException($"{path}: empty scenario");
        }

        scenario.Check(path);
        return scenario;
    }

    private void Check(string path)
    {
        var problems = new List<string>();
        if (!(Redshift >= 0.0 && Redshift <= 20.0))
        {
            problems.Add("redshift must lie in [0, 20]");
        }

        if (!(Volume > 0.0) || !(NumberDensity > 0.0))
        {
            problems.Add("volume and number_density must be positive");
        }

        if (!(KBins.Width > 0.0 && KBins.Min > 0.0 && KBins.Max > KBins.Min))
        {
            problems.Add("k_bins needs 0 < min < max and width > 0");
        }

        if (Multipoles.Length == 0 || Multipoles.Any(l => l is not (0 or 2 or 4)) || !Multipoles.SequenceEqual(Multipoles.Order().Distinct()))
        {
            problems.Add("multipoles must be distinct, increasing, from {0, 2, 4}");
        }

        if (SampledNuisance.Any(s => !(s.Min < s.Max) || s.Start < s.Min || s.Start > s.Max))
        {
            problems.Add("each sampled nuisance parameter needs min < max and start inside [min, max]");
        }

        if (MarginalisedNuisance.Any(m => !(m.Sigma > 0.0)))
        {
            problems.Add("each marginalised nuisance parameter needs sigma > 0");
        }

        if (problems.Count > 0)
        {
            throw new InvalidDataException($"{path}: {string.Join("; ", problems)}");
        }
    }

    /// <summary>Bin centres, h/Mpc: min + (i + 1/2) width while below max.</summary>
    public double[] BinCentres()
    {
        int count = (int)Math.Round((KBins.Max - KBins.Min) / KBins.Width);
        if (Math.Abs(KBins.Min + (count * KBins.Width) - KBins.Max) > 1e-9)
        {
            throw new InvalidDataException(string.Create(CultureInfo.InvariantCulture, $"k_bins: (max - min) / width = {(KBins.Max - KBins.Min) / KBins.Width:G6} is not a whole number"));
        }

        return [.. Enumerable.Range(0, count).Select(i => KBins.Min + ((i + 0.5) * KBins.Width))];
    }
}
