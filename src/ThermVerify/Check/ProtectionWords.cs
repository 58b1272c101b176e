using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>The protection parts' part of the DC-loading finding, in words, with their closed forms beside them.</summary>
internal static class ProtectionWords
{
    public static IEnumerable<string> Loading(FrontEndDesign design, ProtectionSpec protection, CheckPoint p)
    {
        if (protection.HasClamps)
        {
            var celsius = ProtectionEstimate.ClampCelsius(design, p.Celsius);
            var leakage = EngineeringFormat.Format(protection.ClampLeakageAmperesAt(celsius), UnitKind.Ampere, 4);
            var which = protection.ClampLeakageSigned
                ? (protection.ClampLeakageAmperes > 0 ? "the upper clamp diode's" : "the lower clamp diode's")
                : "one clamp diode's";
            yield return I($"{which} reverse leakage {FindingRules.Bounded(leakage, protection.ClampLeakageSigned, protection.ClampLeakageAmperes)} at {celsius:0.##} °C ") +
                         I($"(doubling every {protection.ClampDoublingKelvin:0.##} K) through the {EngineeringFormat.Format(p.Estimates.SourceOhms, UnitKind.Ohm, 4)} the pin sees ") +
                         I($"(Shockley, Ohm's law) {FindingRules.Volts(p.Estimates.ClampVolts)}");
        }
        if (protection.InsulationOhms is { } ohms)
            yield return I($"the insulation's {EngineeringFormat.Format(ohms, UnitKind.Ohm, 4)} to {EngineeringFormat.Format(protection.InsulationToVolts, UnitKind.Volt, 4)} ") +
                         I($"loading the sensor's node (Thevenin) {FindingRules.Volts(p.Estimates.InsulationVolts)}");
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
