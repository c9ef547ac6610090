using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests.Specs;

public class GridSpecReaderTests
{
    [Fact]
    public void The_base_spec_of_these_tests_is_valid()
    {
        // Every refusal below edits this spec, so it must pass on its own for the refusals to mean anything.
        var spec = SpecText.Spec();

        Assert.Equal(2, spec.Varied.Count);
        Assert.Equal(12, spec.K.Count);
        Assert.Equal(8, spec.TotalPoints);
    }

    [Theory]
    [InlineData("colour=\"red\"", "colour: unknown field")]
    [InlineData("vary.omega_x=[0.1, 0.2]", "vary.omega_x: unknown parameter")]
    [InlineData("vary.cs2=[0, 1]", "vary.cs2: is a nuisance parameter")]
    [InlineData("fixed.b1=2", "fixed.b1: is a nuisance parameter")]
    [InlineData("vary.h=[0.7, 0.7]", "vary.h: range [0.7, 0.7] is empty or inverted")]
    [InlineData("vary.h=[0.7, 0.65]", "vary.h: range [0.7, 0.65] is empty or inverted")]
    [InlineData("vary.h=[0.5, 2.5]", "vary.h: range [0.5, 2.5] leaves the allowed range")]
    [InlineData("vary.omega_cdm=[0.1, 0.5]", "vary: the box holds invalid cosmologies; at the corner omega_cdm=0.5, h=0.65")]
    [InlineData("fixed.h=0.67", "fixed.h: is also in vary")]
    [InlineData("fixed.ln10As=3.0|fixed.sigma8=0.8", "ln10As, sigma8: give one amplitude parameter, not both")]
    [InlineData("fixed.Omega_rc=0.5", "Omega_rc: applies only to model=ndgp")]
    [InlineData("model=\"galileon\"", "model: must be one of")]
    [InlineData("output=\"lensing\"", "output: must be \"matter\" or \"galaxy\", got \"lensing\"")]
    [InlineData("k={\"values\": [0.1, 0.05]}", "k[1]: 0.05 does not exceed k[0] = 0.1")]
    [InlineData("k={\"values\": [0.1, 0.1]}", "k[1]: 0.1 does not exceed k[0] = 0.1")]
    [InlineData("k={\"values\": [0.1, 20]}", "k[1]: 20 h/Mpc is outside [0.0001, 10]")]
    [InlineData("k={\"values\": [0.1]}", "k: give at least 2 values")]
    [InlineData("k.count=1", "k.count: must be an integer in [2, 10000]")]
    [InlineData("seed=", "seed: missing")]
    [InlineData("seed=-1", "seed: must be an integer")]
    [InlineData("seed=1.5", "seed: must be an integer")]
    [InlineData("seed=\"7\"", "seed: must be an integer")]
    [InlineData("points.training=1", "points.training: must be an integer in [2, 1000000]")]
    [InlineData("points.heldout=-1", "points.heldout: must be an integer in [0, 1000000]")]
    [InlineData("redshifts=", "redshifts: give the redshifts to compute")]
    [InlineData("vary.z=[0, 1]", "redshifts: z is varied, so leave redshifts out")]
    [InlineData("redshifts=[1.0, 0.5]", "redshifts[1]: 0.5 does not exceed the one before")]
    [InlineData("fixed.z=0.5", "fixed.z: list fixed redshifts in \"redshifts\"")]
    [InlineData("linear={\"command\": []}", "linear.command: must be a non-empty array")]
    [InlineData("linear={\"command\": [\"x\", 3]}", "linear.command: every entry must be a non-empty string")]
    [InlineData("linear={\"command\": [\"x\"], \"shell\": true}", "linear.shell: unknown field")]
    [InlineData("linear={\"command\": [\"x\"], \"timeout_seconds\": 0}", "linear.timeout_seconds: must lie in (0, 604800]")]
    [InlineData("linear={\"command\": [\"x\"], \"k_min\": 0.1, \"k_max\": 1}", "linear.k_min, linear.k_max: need")]
    [InlineData("name=\"../grid\"", "name: \"../grid\" must be 1-64 letters")]
    [InlineData("name=", "name: missing")]
    [InlineData("name=\"\"", "name: \"\" must be 1-64 letters")]
    [InlineData("output=\"\"", "output: must be \"matter\" or \"galaxy\", got \"\"")]
    [InlineData("chunk_size=0", "chunk_size: must be an integer in [1, 100000]")]
    public void Each_invalid_spec_is_refused_with_a_problem_naming_its_field(string edits, string problem)
    {
        var e = Assert.Throws<GridSpecException>(() => GridSpecReader.Parse(SpecText.With(edits.Split('|')), "grid.json"));

        Assert.Contains(e.Problems, p => p.Contains(problem, StringComparison.Ordinal));
        Assert.StartsWith("grid.json: ", e.Message, StringComparison.Ordinal);
        Assert.Contains(problem, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Invalid_json_is_refused_as_such()
    {
        var e = Assert.Throws<GridSpecException>(() => GridSpecReader.Parse("{ \"name\": \"x\", ", "grid.json"));

        Assert.StartsWith("not valid JSON", Assert.Single(e.Problems), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\"vary\": { \"omega_cdm\": [0.11, 0.13], \"h\": [0.65, 0.70] }", "\"vary\": { \"h\": [0.6, 0.8], \"omega_cdm\": [0.11, 0.13], \"h\": [0.65, 0.70] }", "'h'")]
    [InlineData("\"fixed\": { \"omega_b\": 0.0224 }", "\"fixed\": { \"omega_b\": 0.0224, \"omega_b\": 0.0230 }", "'omega_b'")]
    [InlineData("\"seed\": 7,", "\"seed\": 7, \"seed\": 8,", "'seed'")]
    public void A_field_given_twice_is_refused(string field, string twice, string name)
    {
        // JSON leaves duplicate names to the reader; taking either value silently would draw a design the user
        // did not ask for (a varied parameter given twice would even become two design columns).
        Assert.Contains(field, SpecText.Base, StringComparison.Ordinal);

        var e = Assert.Throws<GridSpecException>(() => GridSpecReader.Parse(SpecText.Base.Replace(field, twice, StringComparison.Ordinal), "grid.json"));

        var problem = Assert.Single(e.Problems);
        Assert.StartsWith("not valid JSON", problem, StringComparison.Ordinal);
        Assert.Contains(name, problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_spec_that_is_not_an_object_is_refused()
    {
        var e = Assert.Throws<GridSpecException>(() => GridSpecReader.Parse("[1, 2]", "grid.json"));

        Assert.Equal("the spec must be one JSON object", Assert.Single(e.Problems));
    }

    [Fact]
    public void Every_problem_of_a_spec_is_listed_at_once()
    {
        var e = Assert.Throws<GridSpecException>(() => GridSpecReader.Parse(
            SpecText.With("colour=1", "seed=", "vary.b1=[1, 2]", "redshifts=[1.0, 0.5]", "k={\"values\": [0.1, 0.05]}", "output=\"lensing\""),
            "grid.json"));

        string[] expected = ["colour: unknown field", "seed: missing", "vary.b1: is a nuisance parameter", "redshifts[1]: 0.5 does not exceed", "k[1]: 0.05 does not exceed", "output: must be"];
        foreach (string problem in expected)
        {
            Assert.Contains(e.Problems, p => p.StartsWith(problem, StringComparison.Ordinal));
        }

        Assert.Equal(expected.Length, e.Problems.Count);
        Assert.StartsWith($"grid.json: {expected.Length} problems:", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("")]
    [InlineData("linear={\"command\": [\"sh\", \"-c\", \"cat table.txt\"], \"timeout_seconds\": 30}|k={\"values\": [0.01, 0.02, 0.3]}")]
    [InlineData("output=\"galaxy\"|vary={\"z\": [0.2, 1.1], \"w0\": [-1.2, -0.8]}|redshifts=|fixed={\"sigma8\": 0.8}")]
    public void Canonical_json_reads_back_to_the_same_spec_and_hash(string edits)
    {
        var spec = SpecText.Spec(edits.Split('|', StringSplitOptions.RemoveEmptyEntries));
        string canonical = GridSpecJson.Write(spec);

        var again = GridSpecReader.Parse(canonical, "canonical");

        Assert.Equal(GridSpecJson.Hash(spec), GridSpecJson.Hash(again));
        Assert.Equal(canonical, GridSpecJson.Write(again));
        Assert.Equal(spec.K, again.K);
        Assert.Equal(spec.Varied, again.Varied);
    }

    [Fact]
    public void The_hash_ignores_formatting_but_not_content()
    {
        // Same spec, fields reordered and respaced: same canonical JSON. Another seed: another hash.
        string reordered = """{"seed": 7, "chunk_size": 2, "name": "test-grid", "output": "matter", "vary": {"omega_cdm": [0.11, 0.13], "h": [0.65, 0.7]}, "fixed": {"omega_b": 2.24e-2}, "redshifts": [0.5], "k": {"min": 0.01, "max": 0.3, "count": 12}, "points": {"heldout": 2, "training": 6}}""";

        Assert.Equal(GridSpecJson.Hash(SpecText.Spec()), GridSpecJson.Hash(GridSpecReader.Parse(reordered, "reordered")));
        Assert.NotEqual(GridSpecJson.Hash(SpecText.Spec()), GridSpecJson.Hash(SpecText.Spec("seed=8")));
    }
}
