using System.Text;

namespace ThermVerify.Circuits;

/// <summary>
/// Writes a circuit as an ngspice deck, for running the same circuit in an independent engine. Element
/// names get their SPICE type letter in front (R_, C_, …); temperature-dependent elements are written as
/// expressions of <c>temper</c> so that a <c>.dc temp</c> sweep follows them; TNOM is set to 25 °C and
/// <c>.temp</c> to the circuit temperature. Switches become SPICE switches driven by a control source with
/// 1 ps edges (closing half a picosecond later than here); op-amps are written as the same macro-model
/// from controlled and behavioural sources. ngspice folds names to lower case, so names differing only
/// in case would clash there.
/// </summary>
public static class SpiceDeck
{
    /// <param name="analysisCards">Analysis and control lines, e.g. <c>.dc temp -40 125 1</c> or <c>.tran 10n 1m</c>.</param>
    public static string Write(Circuit circuit, params IEnumerable<string> analysisCards)
    {
        var deck = new SpiceDeckBuilder(circuit.TemperatureCelsius);
        foreach (var e in circuit.Elements)
            e.WriteSpice(deck);
        var text = new StringBuilder();
        text.AppendLine("* thermverify circuit");
        text.AppendLine(".options tnom=25");
        text.AppendLine($".temp {SpiceDeckBuilder.Number(circuit.TemperatureCelsius)}");
        text.Append(deck.Cards);
        text.Append(deck.Models);
        foreach (var card in analysisCards)
            text.AppendLine(card);
        text.AppendLine(".end");
        return text.ToString();
    }

    /// <summary><c>.dc temp</c> over the given range, the stop nudged past rounding so the last point is kept.</summary>
    public static string TemperatureSweep(double fromCelsius, double toCelsius, double stepKelvin) =>
        $".dc temp {SpiceDeckBuilder.Number(fromCelsius)} {SpiceDeckBuilder.Number(toCelsius + stepKelvin * 1e-6)} {SpiceDeckBuilder.Number(stepKelvin)}";
}
