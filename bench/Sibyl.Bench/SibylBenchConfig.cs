using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Diagnosers;
using BenchmarkDotNet.Validators;

namespace Sibyl.Bench;

/// <summary>Shared settings: allocation counts and a hard failure if the JIT optimiser is off.</summary>
public sealed class SibylBenchConfig : ManualConfig
{
    public SibylBenchConfig()
    {
        AddDiagnoser(MemoryDiagnoser.Default);
        AddValidator(JitOptimizationsValidator.FailOnError);
    }
}
