using SkiaSharp;

namespace Sibyl.Plotting.Tests;

public sealed class SpectrumFigureTests : IDisposable
{
    private readonly TemporaryFolder folder = new();

    public void Dispose() => folder.Dispose();

    [Fact]
    public void A_two_panel_log_figure_is_a_png_of_the_requested_size_with_something_drawn()
    {
        string path = folder.File("spectra.png");

        TwoPanelFigure().Save(path, width: 800, heightPerPanel: 350);

        byte[] png = File.ReadAllBytes(path);
        Assert.Equal(PngFile.Signature, png[..8]);
        Assert.Equal((800, 700), PngFile.HeaderSize(png));
        Assert.True(PngFile.DistinctColours(png) > 1, "the figure is a single flat colour");
    }

    [Fact]
    public void The_default_size_is_900_pixels_wide_and_420_per_panel()
    {
        string path = folder.File("default.png");

        TwoPanelFigure().Save(path);

        Assert.Equal((900, 840), PngFile.HeaderSize(File.ReadAllBytes(path)));
    }

    [Fact]
    public void Titles_are_drawn_as_text_and_not_left_blank()
    {
        // A font-less machine renders every label as nothing; the band above the top panel holds its title.
        string path = folder.File("title.png");

        TwoPanelFigure().Save(path, width: 900, heightPerPanel: 420);

        Assert.True(PngFile.InkFraction(File.ReadAllBytes(path), new SKRectI(200, 0, 700, 30)) > 0.005);
    }

    [Fact]
    public void NaN_infinite_zero_and_negative_values_on_log_axes_are_skipped_without_error()
    {
        double[] k = [0.001, 0.01, double.NaN, 0.1, -1, 0, 1, double.PositiveInfinity];
        double[] p = [1e4, double.NaN, 3e3, -5, 2e2, 1e1, 0, 5];
        var figure = new SpectrumFigure("k", AxisScale.Log10);
        figure.AddPanel("noisy", "P", AxisScale.Log10).AddSeries("mixed", k, p);
        string path = folder.File("noisy.png");

        figure.Save(path);

        Assert.Equal(PngFile.Signature, File.ReadAllBytes(path)[..8]);
    }

    [Fact]
    public void A_figure_whose_series_have_no_drawable_point_still_saves()
    {
        var figure = new SpectrumFigure("k", AxisScale.Log10);
        figure.AddPanel("nothing positive", "P", AxisScale.Log10).AddSeries("negative", [0.1, 1], [-1, -2]);
        figure.AddPanel("empty", "P");
        string path = folder.File("empty.png");

        figure.Save(path);

        Assert.Equal((900, 840), PngFile.HeaderSize(File.ReadAllBytes(path)));
    }

    [Fact]
    public void Saving_into_a_missing_folder_throws_an_io_error_naming_the_path()
    {
        string path = Path.Combine(folder.Path, "no-such-folder", "figure.png");

        var error = Assert.ThrowsAny<IOException>(() => TwoPanelFigure().Save(path));

        Assert.Contains(path, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Saving_over_an_existing_figure_replaces_it_and_leaves_no_temporary_file()
    {
        string path = folder.File("replaced.png");
        File.WriteAllText(path, "an older figure");

        TwoPanelFigure().Save(path);

        Assert.Equal(PngFile.Signature, File.ReadAllBytes(path)[..8]);
        Assert.Equal([path], Directory.GetFiles(folder.Path));
    }

    [Fact]
    public void A_failed_move_leaves_the_target_untouched_and_no_temporary_file()
    {
        // A folder where the figure should go cannot be replaced by a file, so the final move fails.
        string path = folder.File("taken.png");
        Directory.CreateDirectory(path);

        var error = Assert.ThrowsAny<IOException>(() => TwoPanelFigure().Save(path));

        Assert.Contains(path, error.Message, StringComparison.Ordinal);
        Assert.True(Directory.Exists(path));
        Assert.Empty(Directory.GetFiles(folder.Path));
    }

    [Fact]
    public void A_path_that_is_not_a_png_is_refused_with_the_path_in_the_message()
    {
        string path = folder.File("figure.svg");

        var error = Assert.Throws<ArgumentException>(() => TwoPanelFigure().Save(path));

        Assert.Contains(path, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_figure_without_panels_cannot_be_saved()
    {
        var figure = new SpectrumFigure("k");

        Assert.Throws<InvalidOperationException>(() => figure.Save(folder.File("none.png")));
    }

    [Theory]
    [InlineData(100, 420)]
    [InlineData(900, 50)]
    [InlineData(20_000, 420)]
    public void Sizes_too_small_to_read_or_too_large_to_render_are_refused(int width, int heightPerPanel)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => TwoPanelFigure().Save(folder.File("size.png"), width, heightPerPanel));
    }

    [Fact]
    public void A_reference_line_that_a_log_axis_cannot_show_is_refused()
    {
        var figure = new SpectrumFigure("k", AxisScale.Log10);

        Assert.Throws<ArgumentOutOfRangeException>(() => figure.AddPanel("ratio", "P", AxisScale.Log10, referenceY: 0));
    }

    [Fact]
    public void A_series_whose_arrays_differ_in_length_is_refused()
    {
        var panel = new SpectrumFigure("k").AddPanel("p", "P");

        Assert.Throws<ArgumentException>(() => panel.AddSeries("short", [1, 2, 3], [1, 2]));
    }

    [Fact]
    public void Series_are_copied_so_later_changes_to_the_caller_s_arrays_do_not_move_the_curve()
    {
        double[] y = [1, 2, 3];
        var panel = new SpectrumFigure("k").AddPanel("p", "P").AddSeries("s", [1, 2, 3], y);

        y[0] = 99;

        Assert.Equal(1, panel.Series[0].Y[0]);
    }

    /// <summary>The two kinds of panel the pipeline draws: a wiggle ratio against log k, and loop terms log-log.</summary>
    private static SpectrumFigure TwoPanelFigure()
    {
        double[] k = [.. Enumerable.Range(0, 200).Select(i => Math.Pow(10, -3 + (3.0 * i / 199)))];
        double[] ratio = [.. k.Select(q => 1 + (0.05 * Math.Sin(q / 0.006) * Math.Exp(-q / 0.2)))];
        double[] p22 = [.. k.Select(q => 2e3 * q / (1 + Math.Pow(q / 0.02, 2.5)))];
        double[] p13 = [.. k.Select(q => -5e3 * q * q / (1 + Math.Pow(q / 0.03, 3)))];

        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        figure.AddPanel("BAO wiggles", "P_total / P_nw", referenceY: 1)
            .AddSeries("z = 0", k, ratio);
        figure.AddPanel("One-loop terms", "|P(k)| [(Mpc/h)^3]", AxisScale.Log10)
            .AddSeries("|P_22|", k, p22)
            .AddSeries("|P_13|", k, [.. p13.Select(Math.Abs)])
            .AddSeries("P_13 (positive part only)", k, p13);
        return figure;
    }
}
