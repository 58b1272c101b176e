namespace ThermVerify.FrontEnd;

/// <summary>
/// The firmware's reading of a code with the nominal model, tabulated once for every code (up to 16 bits), since a
/// Monte Carlo run reads millions of codes; the check reads through the same table, so both give the same number for
/// the same code. An unrounded code x stands for the voltage x·Q (the converter's V/Q scale); between whole codes the
/// reading is linear in x, which differs from the exact inverse by the curve's bend over one LSB only.
/// The table is filled as codes are read: a check (and each of its remedy candidates, every one with a model of its
/// own) reads a few hundred codes of up to 65,536, and filling a 16-bit table ahead took most of such a check.
/// Threads reading the same code at once compute the same value, so a race only repeats work.
/// </summary>
internal sealed class FirmwareReading
{
    private const int MaximumTabulatedBits = 16;
    private readonly double[]? celsiusAtCode;

    public FirmwareReading(ClosedFormModel model)
    {
        Model = model;
        if (model.Adc.Bits <= MaximumTabulatedBits)
        {
            celsiusAtCode = new double[model.Adc.MaxCode - model.Adc.MinCode + 1];
            Array.Fill(celsiusAtCode, NotYetRead);
        }
    }

    // The model gives a finite temperature or NaN, never −∞.
    private const double NotYetRead = double.NegativeInfinity;

    public ClosedFormModel Model { get; }

    /// <summary>The temperature the firmware reports for a whole code; NaN for codes no sensor in range produces.</summary>
    public double Celsius(int code)
    {
        if (celsiusAtCode is not { } table) return Model.ReportedCelsius(code);
        // Signed codes (a differential input) start at MinCode: the table is indexed from there.
        var index = code - Model.Adc.MinCode;
        var celsius = table[index];
        return celsius != NotYetRead ? celsius : table[index] = Model.ReportedCelsius(code);
    }

    /// <summary>The reading for an unrounded value on the V/Q scale (linear between codes); NaN outside the codes.</summary>
    public double CelsiusUnrounded(double idealCode)
    {
        var adc = Model.Adc;
        if (celsiusAtCode is null) return Model.CelsiusAtVolts(idealCode * adc.LsbVolts);
        var code = idealCode - adc.InverseOffsetLsb;
        if (!(code >= adc.MinCode && code <= adc.MaxCode)) return double.NaN;
        var k = Math.Min((int)Math.Floor(code), adc.MaxCode - 1);
        var w = code - k;
        var (low, high) = (Celsius(k), Celsius(k + 1));
        return low + w * (high - low);
    }
}
