namespace ThermVerify.Firmware;

/// <summary>
/// Worst-case spreads for fault thresholds, each a ± fraction (0.01 = ±1 %).
/// When <paramref name="ExcitationTracksReference"/> is true the divider and the ADC share one reference
/// (a ratiometric front end), so their errors cancel in the code and only the fixed resistor's tolerance counts.
/// A bridge adds its opposite half's two resistors (<paramref name="OppositeHighFraction"/>, <paramref name="OppositeLowFraction"/>).
/// </summary>
internal sealed record FaultTolerances(
    double ExcitationFraction = 0,
    double ReferenceFraction = 0,
    double FixedResistorFraction = 0,
    bool ExcitationTracksReference = false,
    double OppositeHighFraction = 0,
    double OppositeLowFraction = 0)
{
    public static readonly FaultTolerances None = new();

    public FaultTolerances Validated()
    {
        Check(ExcitationFraction, "excitation");
        Check(ReferenceFraction, "ADC reference");
        Check(FixedResistorFraction, "fixed resistor");
        Check(OppositeHighFraction, "bridge's opposite high resistor");
        Check(OppositeLowFraction, "bridge's opposite low resistor");
        return this;
    }

    private static void Check(double fraction, string what)
    {
        if (!(fraction >= 0 && fraction < 0.5))
            throw new FirmwareInputException(FormattableString.Invariant(
                $"The {what} tolerance is {fraction}; give a ± fraction from 0 up to 0.5 (0.01 means ±1 %)."));
    }
}
