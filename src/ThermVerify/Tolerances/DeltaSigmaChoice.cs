using ThermVerify.Check;
using ThermVerify.Check.DeltaSigma;

namespace ThermVerify.Tolerances;

/// <summary>
/// The fixed-resistor choice on a design read by a delta-sigma converter: each candidate is checked by the delta-sigma
/// check (FrontEndCheck dispatches to it), whose points carry the static reading through the input's load; beyond the
/// points' errors, a candidate whose input loading, channel-switch settling or interference finding fails the budget is
/// not within it (the fixed or reference resistor sets the source resistance those analyses run through).
/// </summary>
internal static class DeltaSigmaChoice
{
    private static readonly string[] Ids = [DeltaSigmaFindings.InputLoadingId, DeltaSigmaFindings.ChannelSwitchId, DeltaSigmaFindings.InterferenceId];

    public static bool Fails(CheckResult check) =>
        check.DeltaSigma is not null && check.Findings.Any(f => f.Severity == Severity.Fail && Ids.Contains(f.Id));
}
