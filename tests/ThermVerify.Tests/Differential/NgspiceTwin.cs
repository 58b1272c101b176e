using ThermVerify.Circuits;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The circuit as written for ngspice in the differential run. ngspice 39 computes kT/q from the CODATA 2014 values
/// (k = 1.38064852e-23 J/K, q = 1.6021766208e-19 C, its const.h, from memory), the engine from the exact SI values
/// (SI Brochure, 9th ed.): kT/q differs by 3.394e-7 relative. Every diode enters the deck with its emission coefficient
/// scaled by that ratio, so both engines solve the same n·kT/q and the comparison shows the engines, not the constants.
/// The effect of the constants alone is measured separately (<c>DifferentialTests</c>) and stated in docs/engine.md.
/// </summary>
internal static class NgspiceTwin
{
    public static readonly double ThermalVoltageRatio =
        (1.380649e-23 / 1.602176634e-19) / (1.38064852e-23 / 1.6021766208e-19);

    public static Circuit For(Circuit circuit) =>
        new(circuit.Elements.Select(e => e is Diode d ? d with { EmissionCoefficient = d.EmissionCoefficient * ThermalVoltageRatio } : e),
            circuit.TemperatureCelsius);
}
