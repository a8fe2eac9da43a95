using BenchmarkDotNet.Running;
using Lightfold.Benchmarks;

// `quick [name…]`: single-pass rates and ratios against the straightforward reference, measured in the
// same run (what scripts/bench prints). Anything else goes to BenchmarkDotNet, e.g. `--filter '*'`.
if (args.Length > 0 && args[0] == "quick")
    return QuickBench.Run(args[1..], Console.Out);
BenchmarkSwitcher.FromAssembly(typeof(QuickBench).Assembly).Run(args);
return 0;
