namespace Sibyl.Emulation.Validation;

/// <summary>One point's emulated and direct values of every term (term-major over k).</summary>
/// <param name="Label">How the point is named in reports (index and parameters).</param>
/// <param name="Emulated">Emulator values.</param>
/// <param name="Direct">Direct-calculation values.</param>
public sealed record Comparison(string Label, double[] Emulated, double[] Direct);
