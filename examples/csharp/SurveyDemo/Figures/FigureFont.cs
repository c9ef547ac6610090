using SkiaSharp;

namespace Sibyl.Demo.Figures;

/// <summary>
/// The sans-serif family the demo's figures use, chosen as Sibyl.Plotting chooses it (that choice is internal there):
/// ScottPlot's own guess may take a serif family, and with no font at all it would draw no text, so this fails loudly.
/// </summary>
public static class FigureFont
{
    private static readonly string[] Preferred = ["DejaVu Sans", "Liberation Sans", "Noto Sans", "Arial", "Helvetica"];

    private static readonly Lazy<string> Family = new(Resolve);

    /// <summary>The family name.</summary>
    /// <exception cref="InvalidOperationException">No font is installed (on Debian: install fonts-dejavu-core).</exception>
    public static string Sans => Family.Value;

    private static string Resolve()
    {
        string[] installed = [.. SKFontManager.Default.FontFamilies.Where(f => !string.IsNullOrWhiteSpace(f))];
        string? match = Array.Find(Preferred, p => installed.Contains(p, StringComparer.OrdinalIgnoreCase))
            ?? Array.Find(installed, f => f.Contains("Sans", StringComparison.OrdinalIgnoreCase))
            ?? installed.FirstOrDefault();
        return match ?? throw new InvalidOperationException("No font is installed, so figures would have no text; on Debian install fonts-dejavu-core.");
    }
}
