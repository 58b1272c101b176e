using BenchmarkDotNet.Running;

// Run with: dotnet run -c Release --project tests/ThermVerify.Benchmarks -- --filter '*'
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);

public partial class Program;
