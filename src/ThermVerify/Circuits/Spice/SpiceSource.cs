using static ThermVerify.Circuits.Spice.SpiceNumber;

namespace ThermVerify.Circuits.Spice;

internal static class SpiceSource
{
    /// <summary>The AC part of a source line; empty when the source does not drive AC analysis.</summary>
    public static string Ac(double magnitude, double phaseDegrees) =>
        magnitude == 0 ? "" : phaseDegrees == 0 ? $" ac {Format(magnitude)}" : $" ac {Format(magnitude)} {Format(phaseDegrees)}";
}
