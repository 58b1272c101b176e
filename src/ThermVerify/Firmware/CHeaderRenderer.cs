using System.Globalization;
using System.Text;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Provenance;
using ThermVerify.Quantities;

namespace ThermVerify.Firmware;

/// <summary>
/// Renders a self-contained C99 header: the table as const arrays, macros for the unit, span and fault thresholds,
/// and a static inline routine whose integer arithmetic <see cref="FirmwareTable.Evaluate"/> reproduces exactly. The
/// comment block names where the header came from (tool, design files by SHA-256, settings), so a header found in a
/// firmware tree can be traced to the design that made it.
/// </summary>
public static class CHeaderRenderer
{
    public static string Render(FirmwareHeaderContent content, RunProvenance provenance)
    {
        content.Validated();
        var (p, m, t) = (content.Prefix, content.Model, content.Table);
        var P = p.ToUpperInvariant();
        // Signed codes (a differential input) need a signed type; the unsigned ones keep theirs.
        var codeType = m.Adc.Bipolar ? (m.Adc.MaxCode <= short.MaxValue ? "int16_t" : "int32_t") : m.Adc.MaxCode <= ushort.MaxValue ? "uint16_t" : "uint32_t";
        var valueType = t.FitsInt16 ? "int16_t" : "int32_t";
        var sb = new StringBuilder();
        void Line(FormattableString s) => sb.Append(s.ToString(CultureInfo.InvariantCulture)).Append('\n');

        Line($"/* {Ascii(content.DesignName)}: ADC code to temperature.");
        Line($" * Written by thermverify; regenerate it from the design rather than editing it.");
        Line($" *");
        Line($" * Sensor:  {Ascii(m.Sensor.Description)}");
        if (m.Netlist is { } netlist)
        {
            var (ta, tb, tc) = NetlistTransfer.Of(netlist).Coefficients;
            Line($" * Netlist: {Ascii(netlist.File)}, sensor {Ascii(netlist.SensorElements[0])}, converter at node {Ascii(netlist.PinNode)}; its ideal transfer");
            Line($" *          v = (a*R + b)/(c*R + 1), a = {ta:G9}, b = {tb:G9} V, c = {tc:G9} 1/ohm (R the sensor's resistance)");
        }
        else if (m.Bridge is { } bridge)
        {
            Line($" * Bridge:  sensor on the {(m.Side == SensorSide.Low ? "low side (to ground)" : "high side (to the excitation)")} of its half, fixed resistor {m.FixedOhms:G6} ohm, excitation {m.ExcitationVolts:G6} V;");
            Line($" *          opposite half {bridge.HighOhms:G6} ohm over {bridge.LowOhms:G6} ohm; the code reads V_d = V+ - V-{(m.Amplifier is null ? "" : " through the amplifier")}");
            if (m.Amplifier is { } amp)
                Line($" * Amplifier: output = {amp.Gain:G6} * (V_d + {amp.InputOffsetVolts:G6} V), the gain and offset the design declares (bounds are not in the table)");
        }
        else if (m.ExcitationAmperes is { } amps)
            Line($" * Current source: {amps:G6} A through the sensor, node = I*R_s; reference resistor (or V_ref/I) {m.FixedOhms:G6} ohm");
        else
            Line($" * Divider: sensor on the {(m.Side == SensorSide.Low ? "low side (to ground)" : "high side (to the excitation)")}, fixed resistor {m.FixedOhms:G6} ohm, excitation {m.ExcitationVolts:G6} V");
        Line($" * ADC:     {m.Adc.Bits} bits, reference {m.Adc.ReferenceVolts:G6} V, LSB {m.Adc.LsbVolts:G6} V");
        Line($" * Codes:   {m.Adc.Describe()}");
        Line($" * Range:   {m.Range.MinCelsius:0.###} to {m.Range.MaxCelsius:0.###} degC, codes {t.Span.FirstCode} to {t.Span.LastCode}; temperature {(t.Span.TemperatureRisesWithCode ? "rises" : "falls")} with code");
        Line($" * Unit:    {t.Scale.Name}: a value is the temperature in degC times {P}_UNITS_PER_KELVIN, signed");
        Line($" * Table:   {(t.IsDense ? "one value per code, read by index" : $"{t.Codes.Count} breakpoints, linear interpolation between them")}");
        Line($" * Error:   table minus true temperature from {content.Error.MinErrorKelvin:+0.0000;-0.0000} K (code {content.Error.MinErrorCode}) to {content.Error.MaxErrorKelvin:+0.0000;-0.0000} K (code {content.Error.MaxErrorCode});");
        Line($" *          the converter's own quantisation is up to +/-{content.Error.HalfCodeKelvin:0.0000} K (code {content.Error.HalfCodeAtCode}).");
        Line($" * Faults:  a code below {P}_FAULT_BELOW_CODE or above {P}_FAULT_ABOVE_CODE is an open or shorted sensor{(m.Bridge is not null ? ", fixed resistor or opposite-half resistor" : m.Netlist is null ? " or fixed resistor" : m.Netlist.FixedElement is { } f ? " or " + Ascii(f) : "")}.");
        Line($" * Made by: thermverify {Ascii(provenance.ToolVersion)} ({Ascii(provenance.EngineText)}; {Ascii(provenance.SettingsText)})");
        Line($" * Design:  {Ascii(provenance.DesignText())}");
        Line($" * Caution: simulation does not replace measurement on hardware; a safety function needs independent protection.");
        Line($" */");
        Line($"#ifndef {P}_H");
        Line($"#define {P}_H");
        Line($"");
        Line($"#include <stdint.h>");
        Line($"");
        Line($"#define {P}_UNITS_PER_KELVIN {t.Scale.UnitsPerKelvin}");
        Line($"#define {P}_FIRST_CODE {t.Span.FirstCode}");
        Line($"#define {P}_LAST_CODE {t.Span.LastCode}");
        Line($"#define {P}_BREAKPOINTS {t.Codes.Count}");
        Line($"#define {P}_FAULT_BELOW_CODE {content.Faults.FaultBelowCode}");
        Line($"#define {P}_FAULT_ABOVE_CODE {content.Faults.FaultAboveCode}");
        if (content.Coefficients is { } c)
        {
            Line($"");
            Line($"/* For firmware that computes instead: 1/T = A + B ln R + C (ln R)^3 (T in kelvin, R in ohm),");
            Line($" * or 1/T = 1/T0 + ln(R/R0)/BETA. Worst error over the range: Steinhart-Hart three-point {c.ThreePointMaxErrorKelvin:0.0000} K,");
            Line($" * least squares {c.LeastSquaresMaxErrorKelvin:0.0000} K, beta {c.BetaMaxErrorKelvin:0.0000} K. */");
            Line($"#define {P}_SH_A {c.LeastSquares.A:G17}");
            Line($"#define {P}_SH_B {c.LeastSquares.B:G17}");
            Line($"#define {P}_SH_C {c.LeastSquares.C:G17}");
            Line($"#define {P}_BETA_KELVIN {c.Beta.Beta:0.000}");
            Line($"#define {P}_BETA_R0_OHM {c.Beta.R0Ohms:G10}");
            Line($"#define {P}_BETA_T0_KELVIN {c.Beta.T0Celsius + Quantities.PhysicalConstants.ZeroCelsiusInKelvin:0.00}");
        }
        Line($"");
        if (!t.IsDense) Array(sb, codeType, $"{p}_table_codes", P, t.Codes);
        Array(sb, valueType, $"{p}_table_values", P, t.Values);
        Line($"");
        Routine(sb, p, P, codeType, t.IsDense);
        Line($"");
        Line($"static inline int {p}_is_fault({codeType} code)");
        Line($"{{");
        Line($"    return code < {P}_FAULT_BELOW_CODE || code > {P}_FAULT_ABOVE_CODE;");
        Line($"}}");
        Line($"");
        Line($"#endif /* {P}_H */");
        return sb.ToString();
    }

    /// <summary>Plain ASCII for the comment block, so the header reads the same in any editor and toolchain.</summary>
    private static string Ascii(string text)
    {
        var sb = new StringBuilder();
        foreach (var ch in text.Replace("/*", "/ *").Replace("*/", "* /").Replace("°C", "degC").Replace("Ω", "ohm").Replace("β", "beta").Replace("µ", "u"))
            sb.Append(ch is >= ' ' and <= '~' ? ch : ch is '–' or '−' or '—' ? '-' : '?');
        return sb.ToString();
    }

    private static void Array(StringBuilder sb, string type, string name, string P, IReadOnlyList<int> values)
    {
        sb.Append(CultureInfo.InvariantCulture, $"static const {type} {name}[{P}_BREAKPOINTS] = {{\n");
        for (var i = 0; i < values.Count; i += 10)
            sb.Append("    ").Append(string.Join(", ", values.Skip(i).Take(10).Select(v => v.ToString(CultureInfo.InvariantCulture)))).Append(",\n");
        sb.Append("};\n");
    }

    private static void Routine(StringBuilder sb, string p, string P, string codeType, bool dense)
    {
        sb.Append($$"""
            /* Temperature in units of 1/{{P}}_UNITS_PER_KELVIN K for an ADC code. Codes outside the span read as the
             * nearest end value: check {{p}}_is_fault() first. Between breakpoints (c0, v0) and (c1, v1) the result is
             * v0 + round((v1 - v0) * (code - c0) / (c1 - c0)), rounded half away from zero by adding half the divisor
             * to the magnitude before C99's truncating division. Integer arithmetic only; every product fits int32_t. */
            static inline int32_t {{p}}_temperature({{codeType}} code)
            {
                if (code <= {{P}}_FIRST_CODE) return {{p}}_table_values[0];
                if (code >= {{P}}_LAST_CODE) return {{p}}_table_values[{{P}}_BREAKPOINTS - 1];

            """.Replace("\r", ""));
        if (dense)
        {
            sb.Append($"    return {p}_table_values[code - {P}_FIRST_CODE];\n}}\n");
            return;
        }
        sb.Append($$"""
                int32_t lo = 0;
                int32_t hi = {{P}}_BREAKPOINTS - 1;
                while (hi - lo > 1) {
                    const int32_t mid = lo + (hi - lo) / 2;
                    if ({{p}}_table_codes[mid] <= code) lo = mid; else hi = mid;
                }
                const int32_t span = (int32_t){{p}}_table_codes[hi] - (int32_t){{p}}_table_codes[lo];
                const int32_t numerator = ((int32_t){{p}}_table_values[hi] - (int32_t){{p}}_table_values[lo])
                                        * ((int32_t)code - (int32_t){{p}}_table_codes[lo]);
                const int32_t half = span / 2;
                return (int32_t){{p}}_table_values[lo]
                       + (numerator >= 0 ? (numerator + half) / span : -((-numerator + half) / span));
            }

            """.Replace("\r", ""));
    }
}
