using Sibyl.Emulation.Emulators;

namespace Sibyl.Emulation.Tests.Emulators;

public sealed class InputWarpTests
{
    [Fact]
    public void Omega_rc_from_zero_is_warped_by_a_square_root_and_nothing_else_is()
    {
        Assert.Equal(InputWarp.SquareRoot, SpectrumEmulator.WarpFor("Omega_rc", 0.0));
        Assert.Equal(InputWarp.Identity, SpectrumEmulator.WarpFor("Omega_rc", 0.1));
        Assert.Equal(InputWarp.Identity, SpectrumEmulator.WarpFor("h", 0.0));
    }

    [Theory]
    [InlineData(0.04)]
    [InlineData(0.5)]
    [InlineData(1.0)]
    public void Square_root_warp_has_the_derivative_of_a_square_root(double u)
    {
        // d√u/du = 1/(2√u) exactly; central differences with step 1e-6 agree to ~1e-9 relative here.
        var (value, slope) = SpectrumEmulator.Warp(InputWarp.SquareRoot, u);
        Assert.Equal(Math.Sqrt(u), value, 15);
        double numeric = (SpectrumEmulator.Warp(InputWarp.SquareRoot, u + 1e-6).Value - SpectrumEmulator.Warp(InputWarp.SquareRoot, u - 1e-6).Value) / 2e-6;
        Assert.Equal(numeric, slope, 6);
    }

    [Fact]
    public void Square_root_warp_is_continued_oddly_below_zero_with_a_capped_slope()
    {
        Assert.Equal(-0.1, SpectrumEmulator.Warp(InputWarp.SquareRoot, -0.01).Value, 15);
        Assert.Equal(0.5e6, SpectrumEmulator.Warp(InputWarp.SquareRoot, 0.0).Derivative, 6);
    }
}
