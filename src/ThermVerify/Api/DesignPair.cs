using ThermVerify.Check;

namespace ThermVerify.Api;

/// <summary>Two designs checked with the same options, for a side-by-side comparison.</summary>
public sealed record DesignPair(CheckResult First, CheckResult Second)
{
    public bool BothPass => First.Passed && Second.Passed;
}
