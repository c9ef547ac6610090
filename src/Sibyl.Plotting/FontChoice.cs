using SkiaSharp;

namespace Sibyl.Plotting;

/// <summary>
/// Picks the sans-serif family every figure is drawn in. ScottPlot's own guess takes whatever family the font
/// manager lists first (a serif one on Debian), and with no fonts at all it renders text as nothing, which would
/// give a figure without labels; this fails loudly instead.
/// </summary>
internal static class FontChoice
{
    private static readonly string[] Preferred = ["DejaVu Sans", "Liberation Sans", "Noto Sans", "Arial", "Helvetica"];

    private static readonly Lazy<string> Family = new(Resolve);

    public static string SansFamily => Family.Value;

    private static string Resolve()
    {
        string[] installed = [.. SKFontManager.Default.FontFamilies.Where(f => !string.IsNullOrWhiteSpace(f))];
        string? match = Array.Find(Preferred, p => installed.Contains(p, StringComparer.OrdinalIgnoreCase))
            ?? Array.Find(installed, f => f.Contains("Sans", StringComparison.OrdinalIgnoreCase))
            ?? installed.FirstOrDefault();
        return match ?? throw new InvalidOperationException(
            "No font is installed, so a figure would have no readable text. "
            + "On Debian or Ubuntu install the package fonts-dejavu-core.");
    }
}
