using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Provenance;

namespace ThermVerify.Api;

/// <summary>A check, where it came from (<see cref="RunStamp.Check"/>) and, when a baseline was given, its comparison with it.</summary>
public sealed record CheckRun(CheckResult Result, RunProvenance Provenance, BaselineComparison? Baseline)
{
    /// <summary>Every check is within budget, no finding fails, and no baseline figure got worse than its tolerance.</summary>
    public bool Passed => Result.Passed && Baseline?.Passed != false;
}
