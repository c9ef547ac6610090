using BenchmarkDotNet.Running;

return BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args).Any(s => s.HasCriticalValidationErrors) ? 1 : 0;
