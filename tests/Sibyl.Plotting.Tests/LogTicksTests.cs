namespace Sibyl.Plotting.Tests;

public sealed class LogTicksTests
{
    private static string[] MajorLabels(double min, double max, int maxMajorTicks = 10) =>
        [.. LogTicks.Generate(min, max, maxMajorTicks).Where(t => t.IsMajor).OrderBy(t => t.Position).Select(t => t.Label)];

    [Fact]
    public void Decades_are_labelled_with_their_values_not_their_logarithms()
    {
        Assert.Equal(["0.001", "0.01", "0.1", "1"], MajorLabels(-3.1, 0.1));
    }

    [Fact]
    public void Major_ticks_sit_exactly_on_the_decades()
    {
        var positions = LogTicks.Generate(-2.2, 1.3, 10).Where(t => t.IsMajor).Select(t => t.Position).Order();

        Assert.Equal([-2, -1, 0, 1], positions);
    }

    [Fact]
    public void Each_decade_has_minor_ticks_at_two_to_nine_times_its_value()
    {
        var minors = LogTicks.Generate(-0.01, 1.01, 10).Where(t => !t.IsMajor).Select(t => Math.Pow(10, t.Position)).Order().ToArray();

        Assert.Equal([2, 3, 4, 5, 6, 7, 8, 9], minors.Take(8).Select(m => Math.Round(m)));
        Assert.Equal(8, minors.Length);
    }

    [Fact]
    public void Decades_far_from_one_are_labelled_as_powers_of_ten()
    {
        Assert.Equal(["10⁻⁸", "10⁻⁷", "10⁻⁶"], MajorLabels(-8.2, -5.9));
        Assert.Equal(["10⁵", "10⁶"], MajorLabels(4.5, 6.1));
    }

    [Fact]
    public void Many_decades_are_thinned_to_the_labels_that_fit()
    {
        string[] labels = MajorLabels(-12.5, 4.5, maxMajorTicks: 5);

        Assert.InRange(labels.Length, 2, 5);
        Assert.Contains("10⁰", labels);
    }

    [Fact]
    public void A_range_inside_one_decade_gets_one_two_five_labels()
    {
        Assert.Equal(["0.2", "0.5", "1", "2", "5"], MajorLabels(-0.8, 0.75));
    }

    [Fact]
    public void A_range_narrower_than_the_digits_still_gets_at_least_two_labels()
    {
        string[] labels = MajorLabels(Math.Log10(0.95), Math.Log10(1.07), maxMajorTicks: 6);

        Assert.True(labels.Length >= 2);
        Assert.Contains("1.00", labels);
    }
}
