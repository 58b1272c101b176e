using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// Closed forms of the protection parts' DC errors at the pin, first order, beside what the circuit simulates:
/// the leaking clamp diode's reverse current (Shockley, I = I_s·(1 − e^(−V_r/V_t)) at reverse bias V_r) through the
/// resistance the pin sees (Ohm's law), and the insulation resistance loading the sensor's node (Thevenin's theorem:
/// the node moves by (V_ins − V_th)·R_th/(R_th + R_ins)), times the buffer's gain where one follows.
/// </summary>
internal static class ProtectionEstimate
{
    /// <summary>The clamp's shift of the pin at <paramref name="pinVolts"/>: positive when the upper diode leaks into the pin.</summary>
    public static double ClampVolts(FrontEndDesign design, ClosedFormPoint point, double pinVolts, double sourceOhms)
    {
        if (design.Protection is not { HasClamps: true } p) return 0;
        var celsius = ClampCelsius(design, point.Celsius);
        var vt = PhysicalConstants.ThermalVolts(celsius);
        var leakage = p.ClampLeakageAmperesAt(celsius);
        var into = p.ClampLeakageAmperes > 0
            ? leakage * (1 - Math.Exp(-((p.ClampRailVolts ?? design.NominalReferenceVolts) - pinVolts) / vt))
            : -leakage * (1 - Math.Exp(-pinVolts / vt));
        return into * sourceOhms;
    }

    /// <summary>The diodes' temperature: their own, the board's, or the swept one.</summary>
    public static double ClampCelsius(FrontEndDesign design, double sweptCelsius) =>
        design.Protection?.ClampCelsius ?? design.Check.BoardCelsius ?? sweptCelsius;

    /// <summary>The insulation's shift of the pin: the sensor's node pulled towards the insulation's potential.</summary>
    public static double InsulationVolts(FrontEndDesign design, ClosedFormPoint point)
    {
        if (design.Protection is not { InsulationOhms: { } ohms } p) return 0;
        var node = SensorTransfer.OutputVolts(design, point.SensorOhms);
        return design.StageGain * (p.InsulationToVolts - node) * point.TheveninOhms / (point.TheveninOhms + ohms);
    }
}
