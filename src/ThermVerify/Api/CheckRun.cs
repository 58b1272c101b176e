using ThermVerify.Baselines;
using ThermVerify.Check;

namespace ThermVerify.Api;

/// <summary>A check and, when a baseline was given, its comparison with it.</summary>
public sealed record CheckRun(CheckResult Result, BaselineComparison? Baseline)
{
    /// <summary>Every check is within budget, no finding fails, and no baseline figure got worse than its tolerance.</summary>
    public bool Passed => Result.Passed && Baseline?.Passed != false;
}
