using BenchmarkDotNet.Running;

// Runs the benchmarks named on the command line, e.g.
//   dotnet run -c Release --project tests/GlobalFit.Benchmarks -- --filter '*InnerProduct*'
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
