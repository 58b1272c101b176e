using ThermVerify.FrontEnd;

namespace ThermVerify.Tolerances;

/// <summary>
/// The firmware's reading of a code with the nominal model, tabulated once for every code (up to 16 bits), since
/// a Monte Carlo run reads millions of codes. Between codes (an unquantised code) the reading is linear, which
/// differs from the exact inverse by the curve's bend over one LSB only.
/// </summary>
internal sealed class FirmwareReading
{
    private const int MaximumTabulatedBits = 16;
    private readonly ClosedFormModel model;
    private readonly double[]? celsiusAtCode;

    public FirmwareReading(ClosedFormModel model)
    {
        this.model = model;
        if (model.Adc.Bits <= MaximumTabulatedBits)
            celsiusAtCode = [.. Enumerable.Range(0, model.Adc.MaxCode + 1).Select(model.ReportedCelsius)];
    }

    /// <summary>The temperature the firmware reports for a whole code; NaN for codes no sensor in range produces.</summary>
    public double Celsius(int code) => celsiusAtCode is { } table ? table[code] : model.ReportedCelsius(code);

    /// <summary>The reading for an unrounded code (linear between codes); NaN outside the codes.</summary>
    public double CelsiusUnrounded(double code)
    {
        if (celsiusAtCode is not { } table) return model.CelsiusAtVolts(model.Adc.VoltsOf(code));
        if (!(code >= 0 && code <= model.Adc.MaxCode)) return double.NaN;
        var k = Math.Min((int)code, model.Adc.MaxCode - 1);
        var w = code - k;
        return table[k] + w * (table[k + 1] - table[k]);
    }
}
