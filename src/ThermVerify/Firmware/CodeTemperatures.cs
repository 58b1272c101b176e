using System.Globalization;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Firmware;

/// <summary>
/// The true temperature behind each ADC code: the temperature whose divider voltage is the voltage the firmware takes
/// the code to stand for (<see cref="AdcTransfer.VoltsOf"/>: the middle of the code's bin, or its lower edge, as the
/// design's convention says), found by inverting the divider and the sensor.
/// </summary>
internal static class CodeTemperatures
{
    /// <summary>True temperature at <paramref name="code"/> (fractional codes allowed), or NaN outside the sensor's valid range.</summary>
    public static double TrueCelsius(FirmwareModel model, double code) => TrueCelsiusAtVolts(model, model.Adc.VoltsOf(code));

    /// <summary>True temperature whose node voltage is <paramref name="volts"/>, or NaN outside the sensor's valid range.</summary>
    public static double TrueCelsiusAtVolts(FirmwareModel model, double volts)
    {
        var unloaded = UnloadedVolts(model, volts);
        var ohms = model.SensorOhmsAt(unloaded);
        if (!double.IsFinite(ohms)) return double.NaN;
        try
        {
            return model.Sensor.TemperatureCelsius(ohms);
        }
        catch (SensorRangeException)
        {
            return double.NaN;
        }
    }

    /// <summary>
    /// The codes whose true temperature lies inside the model's range. The lowest code (0, or −2^(N−1) for signed codes) and full scale are never in the span:
    /// they also collect every voltage beyond the converter's ends, so they do not name one temperature.
    /// </summary>
    public static CodeSpan Span(FirmwareModel model)
    {
        model.Validated();
        var atMin = model.Adc.CodeReadAs(model.NodeVolts(model.Range.MinCelsius));
        var atMax = model.Adc.CodeReadAs(model.NodeVolts(model.Range.MaxCelsius));
        var first = Math.Max(model.Adc.MinCode + 1, (int)Math.Ceiling(Math.Min(atMin, atMax)));
        var last = Math.Min(model.Adc.MaxCode - 1, (int)Math.Floor(Math.Max(atMin, atMax)));
        // The ideal codes come from the forward model; rounding in the inverse can put an end code a hair outside.
        while (first <= last && !InRange(model, first)) first++;
        while (last >= first && !InRange(model, last)) last--;
        if (last - first < 1)
            throw new FirmwareInputException(FormattableString.Invariant(
                $"The range {model.Range} covers fewer than two ADC codes (ideal codes {atMin:0.##} to {atMax:0.##} of {model.Adc.MinCode}…{model.Adc.MaxCode}); ") +
                "widen the range, use more ADC bits or choose a fixed resistor closer to the sensor's resistance.");
        return new CodeSpan(first, last, TrueCelsius(model, last) > TrueCelsius(model, first));
    }

    /// <summary>True temperature of every code in the span, index 0 at <see cref="CodeSpan.FirstCode"/>.</summary>
    public static double[] ForSpan(FirmwareModel model, CodeSpan span) =>
        [.. Enumerable.Range(span.FirstCode, span.Count).Select(c => TrueCelsius(model, c))];

    private static bool InRange(FirmwareModel model, int code) => model.Range.Contains(TrueCelsius(model, code));

    /// <summary>Solves V_unloaded + correction(V_unloaded) = V_node by fixed-point iteration (loading is a small correction).</summary>
    private static double UnloadedVolts(FirmwareModel model, double nodeVolts)
    {
        if (model.LoadingCorrectionVolts is null) return nodeVolts;
        var unloaded = nodeVolts;
        for (var i = 0; i < 100; i++)
        {
            var next = nodeVolts - model.LoadingCorrectionVolts(unloaded);
            if (Math.Abs(next - unloaded) <= 1e-15 * Math.Max(1, Math.Abs(nodeVolts))) return next;
            unloaded = next;
        }
        throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
            $"The loading correction does not settle at {nodeVolts:G6} V: it changes by more than the voltage itself; check that it returns a small correction in volts, not a voltage."));
    }
}
