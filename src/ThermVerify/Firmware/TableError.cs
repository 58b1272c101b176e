namespace ThermVerify.Firmware;

/// <summary>
/// How far a table's output (as the C routine computes it) is from the true temperature at every code of its span.
/// Error = table − true, in K. <see cref="HalfCodeKelvin"/> is the converter's own quantisation for comparison:
/// the largest distance, in K, from the temperature a code is read as to either edge of its bin (IEEE Std 1241 ±Q/2
/// when the firmware reads the bin's middle).
/// </summary>
public sealed record TableError(
    double MaxErrorKelvin, int MaxErrorCode, double MaxErrorAtCelsius,
    double MinErrorKelvin, int MinErrorCode, double MinErrorAtCelsius,
    double HalfCodeKelvin, int HalfCodeAtCode)
{
    public double MaxAbsErrorKelvin => Math.Max(Math.Abs(MaxErrorKelvin), Math.Abs(MinErrorKelvin));
}

internal static class TableErrorAnalysis
{
    public static TableError Evaluate(FirmwareModel model, FirmwareTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        var span = table.Span;
        double max = double.NegativeInfinity, min = double.PositiveInfinity, half = 0;
        int maxCode = span.FirstCode, minCode = span.FirstCode, halfCode = span.FirstCode;
        double maxAt = double.NaN, minAt = double.NaN;
        for (var code = span.FirstCode; code <= span.LastCode; code++)
        {
            var truth = CodeTemperatures.TrueCelsius(model, code);
            if (double.IsNaN(truth))
                throw new FirmwareInputException($"Code {code} is inside the table's span but has no temperature in the model; the table was made from a different model.");
            var error = table.EvaluateCelsius(code) - truth;
            if (error > max) (max, maxCode, maxAt) = (error, code, truth);
            if (error < min) (min, minCode, minAt) = (error, code, truth);
            var bin = HalfBinKelvin(model, code, truth);
            if (bin > half) (half, halfCode) = (bin, code);
        }
        return new TableError(max, maxCode, maxAt, min, minCode, minAt, half, halfCode);
    }

    /// <summary>Largest |T(edge) − T(read)| over the two edges of the code's bin that the sensor model can still invert.</summary>
    public static double HalfBinKelvin(FirmwareModel model, int code, double centreCelsius)
    {
        var (low, high) = model.Adc.BinVolts(code);
        var below = CodeTemperatures.TrueCelsiusAtVolts(model, low);
        var above = CodeTemperatures.TrueCelsiusAtVolts(model, high);
        var worst = 0.0;
        if (!double.IsNaN(below)) worst = Math.Abs(below - centreCelsius);
        if (!double.IsNaN(above)) worst = Math.Max(worst, Math.Abs(above - centreCelsius));
        return worst;
    }
}
