using System.Buffers.Binary;
using SkiaSharp;

namespace Sibyl.Plotting.Tests;

/// <summary>Reads back what a saved figure is, independently of how it was drawn.</summary>
internal static class PngFile
{
    public static readonly byte[] Signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];

    /// <summary>Width and height from the IHDR chunk, which the PNG format requires to come first.</summary>
    public static (int Width, int Height) HeaderSize(byte[] png)
    {
        Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(png, 12, 4));
        return (BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(16, 4)), BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20, 4)));
    }

    public static int DistinctColours(byte[] png)
    {
        using SKBitmap bitmap = SKBitmap.Decode(png) ?? throw new InvalidDataException("The PNG does not decode.");
        return bitmap.Pixels.Distinct().Count();
    }

    /// <summary>Share of pixels darker than mid-grey in a box, which is zero where no text or line is drawn.</summary>
    public static double InkFraction(byte[] png, SKRectI box)
    {
        using SKBitmap bitmap = SKBitmap.Decode(png) ?? throw new InvalidDataException("The PNG does not decode.");
        int dark = 0;
        for (int y = box.Top; y < box.Bottom; y++)
        {
            for (int x = box.Left; x < box.Right; x++)
            {
                SKColor c = bitmap.GetPixel(x, y);
                if (c.Red + c.Green + c.Blue < 3 * 128)
                {
                    dark++;
                }
            }
        }

        return dark / (double)(box.Width * box.Height);
    }
}
