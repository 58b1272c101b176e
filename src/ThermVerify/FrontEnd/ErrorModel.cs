using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.FrontEnd;

/// <summary>The samples a reading may be taken from.</summary>
internal enum SampleKinds { Both, FirstOnly, SteadyOnly }

/// <summary>One reading the firmware may make at one temperature: which corner of the bounds, which precharge case, first or steady sample.</summary>
internal readonly record struct ReadingChoice(int Corner, int Case, bool First, double SampleVolts, double UnroundedCode, int Code, double ErrorKelvin);

/// <summary>
/// Everything the reading at each temperature of the grid depends on, for one design (the check) or one built unit
/// (worst case, Monte Carlo). Circuit effects are simulated voltages (the DC levels at each corner of the bounds, the
/// sampling offsets per precharge case); the sensor's warming is a voltage added at the pin; the converter's errors act
/// on the code. Arrays are indexed [corner][point], [corner][case][point] and [case][point].
/// </summary>
internal sealed record ErrorInputs(
    IReadOnlyList<double> Celsius,
    IReadOnlyList<double[]> StaticPinVolts,
    IReadOnlyList<IReadOnlyList<double[]>> AveragePinVolts,
    IReadOnlyList<double[]> FirstOffsetVolts,
    IReadOnlyList<double[]> SteadyOffsetVolts,
    double[] SelfHeatingVolts,
    IReadOnlyList<double[]> ConverterLsbVolts,
    IReadOnlyList<ConverterErrors> ConverterCases,
    int Bits)
{
    /// <summary>Which samples the readings cover: both (every analysis), or only the first or the steady one (a remedy search on one reading).</summary>
    public SampleKinds Kinds { get; init; } = SampleKinds.Both;

    public int CornerCount => StaticPinVolts.Count;

    public int CaseCount => FirstOffsetVolts.Count;

    /// <summary>The converter's negative input per corner where the wiring puts it on a lead; null: ground.</summary>
    public IReadOnlyList<double[]>? NegativeInputVolts { get; init; }

    /// <summary>
    /// The voltage the converter samples: the DC level it starts from, the sampling offset and the sensor's warming, less
    /// its negative input (read at its DC level).
    /// </summary>
    public double SampleVolts(int i, int corner, int precharge, bool first) =>
        (first ? StaticPinVolts[corner][i] + FirstOffsetVolts[precharge][i] : AveragePinVolts[corner][precharge][i] + SteadyOffsetVolts[precharge][i])
        + SelfHeatingVolts[i] - (NegativeInputVolts?[corner][i] ?? 0);

    /// <summary>The converter's unrounded code for a sample: V over its own LSB, bent by its static errors at that corner.</summary>
    public double UnroundedCode(int i, double sampleVolts, int corner) =>
        ConverterCases[corner].Code(sampleVolts / ConverterLsbVolts[corner][i], Bits, MinCode);

    /// <summary>The converter's lowest code (−2^(N−1) for signed codes, else 0).</summary>
    public int MinCode { get; init; }
}

/// <summary>
/// The one error model every analysis uses (check, worst case, Monte Carlo): at each temperature the firmware's
/// reading of every case (corner of the bounds × precharge case × first or steady sample) is formed the same way, and
/// the worst, the largest |reported − true| (an unreadable code counts as the largest; the first found wins a tie), is
/// the reading the analysis reports. A built unit has no bounds (one corner); a design's bounds make two.
/// </summary>
internal static class ErrorModel
{
    public static ErrorInputs Inputs(FrontEndDesign design, ISensorModel sensor, IReadOnlyList<double> temperatures, DcCorners dc,
        IReadOnlyList<double[]> firstOffsets, IReadOnlyList<double[]> steadyOffsets, Converter converter)
    {
        var board = design.Check.BoardCelsius;
        var heat = SelfHeating.PinVolts(design, sensor, temperatures, dc.Base.DividerVolts);
        var corners = dc.Corners.Count;
        // A reference the circuit makes (a reference resistor) is read from the corner's own sweep, over the
        // programmable gain (the converter's scale at the pin).
        var lsb = Enumerable.Range(0, corners).Select(k => dc.Corners[k].ReferenceVolts is { } reference
            ? reference.Select(v => v / design.Adc.ProgrammableGain / (1 << converter.Bits)).ToArray()
            : temperatures.Select(t => converter.LsbVoltsAt(board ?? t, k)).ToArray()).ToArray();
        return new ErrorInputs(temperatures, [.. dc.Corners.Select(c => c.StaticPinVolts)], [.. dc.Corners.Select(c => c.AveragePinVolts)],
            firstOffsets, steadyOffsets, heat, lsb, [.. Enumerable.Range(0, corners).Select(k => converter.Cases[Math.Min(k, converter.Cases.Count - 1)])], converter.Bits)
        {
            NegativeInputVolts = dc.Base.NegativeInputVolts is null ? null : [.. dc.Corners.Select(c => c.NegativeInputVolts!)],
            MinCode = design.Adc.IsBipolar ? -(1 << (converter.Bits - 1)) : 0,
        };
    }

    /// <summary>The worst reading at point <paramref name="i"/>, and the worst unquantised error there (for sensitivities).</summary>
    public static (ReadingChoice Worst, double WorstUnquantisedKelvin) WorstAt(ErrorInputs inputs, int i, FirmwareReading reading)
    {
        var t = inputs.Celsius[i];
        var adc = reading.Model.Adc;
        ReadingChoice worst = default;
        var (key, keyUnquantised, worstUnquantised) = (-1.0, -1.0, 0.0);
        for (var k = 0; k < inputs.CornerCount; k++)
            for (var c = 0; c < inputs.CaseCount; c++)
                foreach (var first in (ReadOnlySpan<bool>)[true, false])
                {
                    if (inputs.Kinds == (first ? SampleKinds.SteadyOnly : SampleKinds.FirstOnly)) continue;
                    var volts = inputs.SampleVolts(i, k, c, first);
                    var x = inputs.UnroundedCode(i, volts, k);
                    var code = adc.Quantise(x);
                    var error = reading.Celsius(code) - t;
                    var size = double.IsFinite(error) ? Math.Abs(error) : double.PositiveInfinity;
                    if (size > key) (key, worst) = (size, new ReadingChoice(k, c, first, volts, x, code, error));
                    var exact = reading.CelsiusUnrounded(x) - t;
                    var sizeUnquantised = double.IsFinite(exact) ? Math.Abs(exact) : double.PositiveInfinity;
                    if (sizeUnquantised > keyUnquantised) (keyUnquantised, worstUnquantised) = (sizeUnquantised, exact);
                }
        return (worst, worstUnquantised);
    }

    /// <summary>The index of the largest |error| (an unreadable reading counts as the largest; the first wins a tie).</summary>
    public static int WorstIndex(IReadOnlyList<double> errorKelvin)
    {
        var worst = 0;
        var key = -1.0;
        for (var i = 0; i < errorKelvin.Count; i++)
        {
            var k = double.IsFinite(errorKelvin[i]) ? Math.Abs(errorKelvin[i]) : double.PositiveInfinity;
            if (k > key) (key, worst) = (k, i);
        }
        return worst;
    }
}
