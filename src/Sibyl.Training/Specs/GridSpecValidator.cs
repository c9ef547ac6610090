using System.Globalization;
using System.Text.RegularExpressions;
using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Training.Specs;

/// <summary>The checks of a grid spec that need physics: names, physical ranges, every corner of the box, k limits.</summary>
internal static partial class GridSpecValidator
{
    public static void Check(GridSpec spec, List<string> problems)
    {
        // An empty name is checked too; a missing or non-string one the reader has reported already.
        if (!SafeName().IsMatch(spec.Name) && !problems.Any(p => p.StartsWith("name: ", StringComparison.Ordinal)))
        {
            problems.Add($"name: \"{spec.Name}\" must be 1-64 letters, digits, '.', '_' or '-' (it names files)");
        }

        if (!ParameterCatalog.Models.ContainsKey(spec.Model))
        {
            problems.Add($"model: must be one of {string.Join(", ", ParameterCatalog.Models.Keys)}, got \"{spec.Model}\"");
        }

        int before = problems.Count;
        CheckVaried(spec, problems);
        CheckFixed(spec, problems);
        CheckRedshifts(spec, problems);
        if (problems.Count == before && ParameterCatalog.Models.ContainsKey(spec.Model))
        {
            CheckCorners(spec, problems);
        }

        CheckK(spec, problems);
        CheckLinear(spec, problems);
    }

    private static ParameterDefinition? Definition(string name) =>
        name == ParameterCatalog.Redshift.Name ? ParameterCatalog.Redshift : ParameterCatalog.All.FirstOrDefault(d => d.Name == name);

    private static string? NameProblem(string name)
    {
        if (name == MatterLayout.SoundSpeed || GalaxyLayout.Nuisance.Any(d => d.Name == name))
        {
            return "is a nuisance parameter: the training set keeps every basis term, so it is applied afterwards; leave it out";
        }

        return Definition(name) is null
            ? $"unknown parameter; known: {string.Join(", ", ParameterCatalog.All.Select(d => d.Name).Append(ParameterCatalog.Redshift.Name))}"
            : null;
    }

    /// <summary>The fit and a user's program ignore N_eff and Y_He; a spec setting them would train on a flat direction.</summary>
    private static string? SourceProblem(GridSpec spec, string name) =>
        !spec.UsesBoltzmann && ParameterCatalog.BoltzmannOnly.Any(d => d.Name == name)
            ? $"is read only by the Boltzmann solver; set \"{ParameterCatalog.LinearName}\": \"{ParameterCatalog.NameOf(LinearSource.Boltzmann)}\" or leave it out"
            : null;

    private static void CheckVaried(GridSpec spec, List<string> problems)
    {
        if (spec.Varied.Count == 0)
        {
            problems.Add("vary: give at least one parameter to span");
        }

        if (spec.Varied.Count > GridSpecReader.MaxVaried)
        {
            problems.Add($"vary: at most {GridSpecReader.MaxVaried} parameters, got {spec.Varied.Count}");
        }

        foreach (var v in spec.Varied)
        {
            string field = $"vary.{v.Name}";
            if ((NameProblem(v.Name) ?? SourceProblem(spec, v.Name)) is { } problem)
            {
                problems.Add($"{field}: {problem}");
                continue;
            }

            var definition = Definition(v.Name)!;
            if (!(v.Min < v.Max))
            {
                problems.Add(string.Create(CultureInfo.InvariantCulture, $"{field}: range [{v.Min:G}, {v.Max:G}] is empty or inverted; need min < max"));
            }
            else if (!definition.Allows(v.Min) || !definition.Allows(v.Max))
            {
                problems.Add(string.Create(CultureInfo.InvariantCulture, $"{field}: range [{v.Min:G}, {v.Max:G}] leaves the allowed range {definition.Range}"));
            }
        }

        var names = spec.Varied.Select(v => v.Name).ToHashSet(StringComparer.Ordinal);
        bool hasAmplitude = names.Contains(ParameterCatalog.Ln10As.Name) || spec.Fixed.ContainsKey(ParameterCatalog.Ln10As.Name);
        bool hasSigma8 = names.Contains(ParameterCatalog.Sigma8.Name) || spec.Fixed.ContainsKey(ParameterCatalog.Sigma8.Name);
        if (hasAmplitude && hasSigma8)
        {
            problems.Add("ln10As, sigma8: give one amplitude parameter, not both");
        }
    }

    private static void CheckFixed(GridSpec spec, List<string> problems)
    {
        foreach (var (name, value) in spec.Fixed)
        {
            string field = $"fixed.{name}";
            if (name == ParameterCatalog.Redshift.Name)
            {
                problems.Add($"{field}: list fixed redshifts in \"redshifts\" instead");
                continue;
            }

            if ((NameProblem(name) ?? SourceProblem(spec, name)) is { } problem)
            {
                problems.Add($"{field}: {problem}");
                continue;
            }

            if (spec.Varied.Any(v => v.Name == name))
            {
                problems.Add($"{field}: is also in vary; a parameter is either varied or fixed");
                continue;
            }

            var definition = Definition(name)!;
            if (!definition.Allows(value))
            {
                problems.Add(string.Create(CultureInfo.InvariantCulture, $"{field}: {value:G} is outside the allowed range {definition.Range}"));
            }
        }
    }

    private static void CheckRedshifts(GridSpec spec, List<string> problems)
    {
        if (spec.VariesRedshift)
        {
            if (spec.Redshifts.Count > 0)
            {
                problems.Add("redshifts: z is varied, so leave redshifts out");
            }

            return;
        }

        if (spec.Redshifts.Count == 0)
        {
            problems.Add("redshifts: give the redshifts to compute at every point (or vary z)");
        }

        for (int i = 0; i < spec.Redshifts.Count; i++)
        {
            double z = spec.Redshifts[i];
            if (!ParameterCatalog.Redshift.Allows(z))
            {
                problems.Add(string.Create(CultureInfo.InvariantCulture, $"redshifts[{i}]: {z:G} is outside the allowed range {ParameterCatalog.Redshift.Range}"));
            }
            else if (i > 0 && !(z > spec.Redshifts[i - 1]))
            {
                problems.Add(string.Create(CultureInfo.InvariantCulture, $"redshifts[{i}]: {z:G} does not exceed the one before; list them increasing, without repeats"));
            }
        }
    }

    /// <summary>
    /// Ω_m, w0 + wa and the model rules are monotone or linear in each parameter, so a box whose corners are all
    /// valid cosmologies holds only valid cosmologies.
    /// </summary>
    private static void CheckCorners(GridSpec spec, List<string> problems)
    {
        int d = spec.Varied.Count;
        var corner = new double[d];
        for (int mask = 0; mask < 1 << d; mask++)
        {
            for (int c = 0; c < d; c++)
            {
                corner[c] = (mask & (1 << c)) == 0 ? spec.Varied[c].Min : spec.Varied[c].Max;
            }

            try
            {
                var cosmology = GridPoint.Cosmology(spec, corner);
                if (spec.UsesBoltzmann)
                {
                    // The solver's background adds radiation, so matter near Ω_m = 1 or an N_eff outside its range fails there.
                    _ = new RadiationBackground(cosmology);
                }
            }
            catch (ParameterOutOfRangeException e)
            {
                string at = string.Join(", ", spec.Varied.Select((v, c) => string.Create(CultureInfo.InvariantCulture, $"{v.Name}={corner[c]:G}")));
                problems.Add($"vary: the box holds invalid cosmologies; at the corner {at}: {e.Message}");
                return;
            }
        }
    }

    private static void CheckK(GridSpec spec, List<string> problems)
    {
        if (spec.K.Count == 0)
        {
            return;
        }

        // The plans' own rule, so that a spec accepted here is never refused when the run builds them.
        if (LoopRange.FindWavenumberProblem(spec.K.ToArray(), spec.LinearKMin, spec.LinearKMax) is (int index, string problem))
        {
            problems.Add($"k[{index}]: {problem}");
            return;
        }

        if (spec.K.Count < 2)
        {
            problems.Add("k: give at least 2 values");
        }
    }

    private static void CheckLinear(GridSpec spec, List<string> problems)
    {
        if (spec.Linear is not { } linear)
        {
            return;
        }

        if (!(linear.TimeoutSeconds > 0 && linear.TimeoutSeconds <= 7 * 86400))
        {
            problems.Add(string.Create(CultureInfo.InvariantCulture, $"linear.timeout_seconds: must lie in (0, 604800], got {linear.TimeoutSeconds:G}"));
        }

        if (!(linear.KMin >= LinearSpectrumFactory.DefaultKMin && linear.KMax <= LinearSpectrumFactory.DefaultKMax && linear.KMin * 100 <= linear.KMax))
        {
            problems.Add(string.Create(
                CultureInfo.InvariantCulture,
                $"linear.k_min, linear.k_max: need {LinearSpectrumFactory.DefaultKMin:G} <= k_min, k_max <= {LinearSpectrumFactory.DefaultKMax:G} and k_max >= 100 k_min, got [{linear.KMin:G}, {linear.KMax:G}]"));
        }
    }

    [GeneratedRegex("^[A-Za-z0-9._-]{1,64}$")]
    private static partial Regex SafeName();
}
