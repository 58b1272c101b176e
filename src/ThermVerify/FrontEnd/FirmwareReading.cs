namespace ThermVerify.FrontEnd;

/// <summary>
/// The firmware's reading of a code with the nominal model, tabulated once for every code (up to 16 bits), since a
/// Monte Carlo run reads millions of codes; the check reads through the same table, so both give the same number for
/// the same code. An unrounded code x stands for the voltage x·Q (the converter's V/Q scale); between whole codes the
/// reading is linear in x, which differs from the exact inverse by the curve's bend over one LSB only.
/// </summary>
internal sealed class FirmwareReading
{
    private const int MaximumTabulatedBits = 16;
    private readonly double[]? celsiusAtCode;

    public FirmwareReading(ClosedFormModel model)
    {
        Model = model;
        if (model.Adc.Bits <= MaximumTabulatedBits)
            celsiusAtCode = [.. Enumerable.Range(0, model.Adc.MaxCode + 1).Select(model.ReportedCelsius)];
    }

    public ClosedFormModel Model { get; }

    /// <summary>The temperature the firmware reports for a whole code; NaN for codes no sensor in range produces.</summary>
    public double Celsius(int code) => celsiusAtCode is { } table ? table[code] : Model.ReportedCelsius(code);

    /// <summary>The reading for an unrounded value on the V/Q scale (linear between codes); NaN outside the codes.</summary>
    public double CelsiusUnrounded(double idealCode)
    {
        var adc = Model.Adc;
        if (celsiusAtCode is not { } table) return Model.CelsiusAtVolts(idealCode * adc.LsbVolts);
        var code = idealCode - adc.InverseOffsetLsb;
        if (!(code >= 0 && code <= adc.MaxCode)) return double.NaN;
        var k = Math.Min((int)code, adc.MaxCode - 1);
        var w = code - k;
        return table[k] + w * (table[k + 1] - table[k]);
    }
}
