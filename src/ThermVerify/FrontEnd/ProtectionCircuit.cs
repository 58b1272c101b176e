using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The protection parts of a design in its circuit: the clamp diodes at the pin (the engine's Shockley diode, Is the
/// reverse leakage) and the insulation resistance from the sensor's signal node to its potential.
/// </summary>
internal static class ProtectionCircuit
{
    public const string UpperClamp = "Dclamp_hi";
    public const string LowerClamp = "Dclamp_lo";
    public const string Insulation = "Rinsulation";

    /// <summary>
    /// Adds the clamp diode and the insulation. Of the clamp pair only the diode that leaks is built: a bound is taken by
    /// the check as the upper diode leaking into the pin at one corner and the lower one leaking out of it at the other,
    /// and a value written with its sign names the diode; the other diode's leakage would flow the opposite way and
    /// only lessen the error, so leaving it out is the worst case.
    /// </summary>
    public static void Add(List<Element> elements, FrontEndDesign design, string pin)
    {
        if (design.Protection is not { } p) return;
        if (p.HasClamps)
        {
            if (p.ClampLeakageAmperes > 0)
            {
                elements.Add(new VoltageSource("Vclamp", ClampRail, Circuit.Ground, new DcWaveform(p.ClampRailVolts ?? design.NominalReferenceVolts)));
                elements.Add(At(new Diode(UpperClamp, pin, ClampRail), p, design.Check.BoardCelsius));
            }
            else
                elements.Add(At(new Diode(LowerClamp, Circuit.Ground, pin), p, design.Check.BoardCelsius));
        }
        if (p.InsulationOhms is { } ohms)
        {
            // The sensor's signal wire: its end towards the converter (the bottom of a high-side sensor).
            var node = design.Wiring is null ? Divider : design.Divider?.SensorSide == SensorSide.High ? SensorBottom : SensorTop;
            if (p.InsulationToVolts == 0)
                elements.Add(new Resistor(Insulation, node, Circuit.Ground, ohms));
            else
            {
                elements.Add(new VoltageSource("Vinsulation", InsulationPotential, Circuit.Ground, new DcWaveform(p.InsulationToVolts)));
                elements.Add(new Resistor(Insulation, node, InsulationPotential, ohms));
            }
        }
    }

    /// <summary>
    /// The diode at its own temperature: fixed there (its stated temperature, or the board's), or following the sweep
    /// with the leakage doubling every <see cref="ProtectionSpec.ClampDoublingKelvin"/>.
    /// </summary>
    private static Diode At(Diode diode, ProtectionSpec p, double? boardCelsius) =>
        (p.ClampCelsius ?? boardCelsius) is { } fixedCelsius
            ? diode with { SaturationCurrentAmperes = p.ClampLeakageAmperesAt(fixedCelsius) }
            : diode with
            {
                SaturationCurrentAmperes = Math.Abs(p.ClampLeakageAmperes),
                SaturationReferenceCelsius = p.ClampLeakageCelsius,
                LeakageDoublingKelvin = p.ClampDoublingKelvin,
            };
}
