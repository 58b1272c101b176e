using ThermVerify.Check;
using ThermVerify.Provenance;

namespace ThermVerify.Api;

/// <summary>Two designs checked with the same options, for a side-by-side comparison, each with where it came from.</summary>
public sealed record DesignPair(CheckResult First, CheckResult Second, RunProvenance FirstProvenance, RunProvenance SecondProvenance)
{
    public bool BothPass => First.Passed && Second.Passed;
}
