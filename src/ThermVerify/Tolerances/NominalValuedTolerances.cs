using ThermVerify.Design;

namespace ThermVerify.Tolerances;

/// <summary>
/// The tolerances of values the design states with a nominal: a resistance, β, an RTD's class, the excitation, a
/// current, the reference. `check` verifies the unit whose parts sit at their nominal values; `worstcase` and
/// `montecarlo` spread these. Bounds without a nominal (offsets, tempcos, INL, leakage, bias currents) are not listed:
/// `check` already takes each at its worse sign.
/// </summary>
internal static class NominalValuedTolerances
{
    public static IReadOnlyList<ToleranceParameter> Of(FrontEndDesign design) =>
        [.. ToleranceSet.From(design).Parameters.Where(p => HasNominal(p.Kind))];

    private static bool HasNominal(ToleranceKind kind) => kind is ToleranceKind.SensorResistance or ToleranceKind.SensorBeta
        or ToleranceKind.RtdClass or ToleranceKind.FixedResistance or ToleranceKind.Excitation or ToleranceKind.Reference
        or ToleranceKind.Current or ToleranceKind.ReferenceResistance or ToleranceKind.BridgeHighResistance
        or ToleranceKind.BridgeLowResistance or ToleranceKind.NetlistPartValue;
}
