using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>A current excitation's part of the DC-loading finding, in words, with its closed form beside it.</summary>
internal static class CurrentWords
{
    public static string Loading(FrontEndDesign design, CurrentSourceSpec source, CheckPoint p)
    {
        var board = design.Check.BoardCelsius ?? p.Celsius;
        var words = new List<string>();
        if (source.CurrentTempcoPerKelvin != 0)
            words.Add("its tempco " + FindingRules.Bounded(I($"{Math.Abs(source.CurrentTempcoPerKelvin) * 1e6:0.###} ppm/K"), source.CurrentTempcoSigned, source.CurrentTempcoPerKelvin) +
                      (source.ReferenceResistorOhms is null ? "" : " (cancels: the reference resistor carries the same current)"));
        if (source.OutputResistanceOhms is { } output)
            words.Add("its output resistance " + EngineeringFormat.Format(output, UnitKind.Ohm, 4));
        if (source.ReferenceResistorOhms is not null && source.ReferenceResistorTempcoPerKelvin != 0)
            words.Add("the reference resistor's tempco " + FindingRules.Bounded(I($"{Math.Abs(source.ReferenceResistorTempcoPerKelvin) * 1e6:0.###} ppm/K"),
                source.ReferenceResistorTempcoSigned, source.ReferenceResistorTempcoPerKelvin));
        if (source.ReferenceInputOhms is { } input)
            words.Add("the reference input's " + EngineeringFormat.Format(input, UnitKind.Ohm, 4) + " across the reference resistor");
        var scale = source.ReferenceResistorOhms is null ? "" : ", read over the reference I·R_ref";
        var leads = design.Wiring is { } w
            ? I($"; the {w.Wires}-wire leads of {EngineeringFormat.Format(w.LeadOhms, UnitKind.Ohm, 4)} each at {(w.LeadCelsius ?? board):0.##} °C ") +
              (w.Wires switch { 2 => "(2·I·R_L)", 3 => "(the mismatch term −m·I·R_L)", _ => "(the input current times the sense lead)" }) +
              I($" {FindingRules.Volts(p.Estimates.LeadVolts)}")
            : "";
        return I($"the current source of {EngineeringFormat.Format(source.CurrentAmperes, UnitKind.Ampere, 4)} at {board:0.##} °C") +
               (words.Count == 0 ? "" : " (" + string.Join(", ", words) + ")") +
               I($": the network by Kirchhoff's laws{scale} puts the pin {FindingRules.Volts(p.Estimates.ExcitationVolts)} from I·R_s") + leads;
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
