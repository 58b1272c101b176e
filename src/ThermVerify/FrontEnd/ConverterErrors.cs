using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// A converter's static errors in the terms of IEEE Std 1241: the code transition levels are the ideal ones scaled
/// by the gain error, shifted by the offset error and bent by the integral nonlinearity. The INL is taken as a bow
/// that is zero at both ends of the scale and peaks at mid-scale, 4·x·(1 − x) times <see cref="InlBowLsb"/> (the
/// end-point fit makes INL vanish at the ends; the bow shape is a modelling choice, common practice, no source). A
/// built unit has one signed bow; a design states INL as a bound, so its check covers the bow of either sign.
/// </summary>
internal readonly record struct ConverterErrors(double OffsetLsb, double GainError, double InlBowLsb)
{
    public static ConverterErrors None => default;

    /// <summary>The unrounded code the converter produces for an ideal code (input over the converter's own LSB).</summary>
    /// <param name="minCode">The lowest code (−2^(N−1) for signed codes): the bow is zero at both ends of the scale, wherever it starts.</param>
    public double Code(double idealCode, int bits, int minCode = 0)
    {
        var x = (idealCode - minCode) / (1 << bits);
        return idealCode * (1 + GainError) + OffsetLsb + InlBowLsb * 4 * x * (1 - x);
    }

    /// <summary>
    /// The converter's gain error with the programmable-gain stage's ahead of it: the code scales with
    /// G·(1 + e_amp)·(1 + e_adc), so the two errors multiply.
    /// </summary>
    public static double WithAmplifier(double converterGainError, double amplifierGainError) =>
        (1 + converterGainError) * (1 + amplifierGainError) - 1;

    /// <summary>
    /// A design's converter errors at its two corners (or its one, when it has no bound): offset and gain at the sign
    /// written, or, written without a sign, at the sign that raises the code at the upper corner and lowers it at the
    /// lower; INL is always a bound (its bow up, then down).
    /// </summary>
    public static IReadOnlyList<ConverterErrors> CornersOf(FrontEndDesign design)
    {
        var adc = design.Adc;
        var stage = adc.GainStage;
        ConverterErrors At(double direction) => new(
            adc.OffsetErrorSigned ? adc.OffsetErrorLsb : direction * Math.Abs(adc.OffsetErrorLsb),
            WithAmplifier(adc.GainErrorSigned ? adc.GainError : direction * Math.Abs(adc.GainError),
                stage is null ? 0 : stage.GainErrorSigned ? stage.GainError : direction * Math.Abs(stage.GainError)),
            direction * adc.InlLsb);
        return StaticBounds.Any(design) ? [At(1), At(-1)] : [At(1)];
    }
}

/// <summary>
/// The converter as built: its reference (the excitation when ratiometric), the reference's tempco at the board
/// temperature (a fixed reference only), and its static-error cases. Its LSB is what the code is a multiple of; the
/// firmware still reads codes with the nominal LSB, so a reference error shows as a gain error of the reading.
/// </summary>
/// <param name="Cases">The converter's errors at each corner of the design's bounds (one entry for a built unit).</param>
/// <param name="TempcoIsBound">The reference tempco was written without a sign: at each corner it takes the sign that moves the code that way.</param>
internal sealed record Converter(int Bits, double ReferenceVolts, double ReferenceTempcoPerKelvin, IReadOnlyList<ConverterErrors> Cases, bool TempcoIsBound = false)
{
    public static Converter Of(FrontEndDesign design) =>
        new(design.Adc.Bits, design.FullScaleAtPinVolts,
            design.Adc.IsRatiometric ? 0 : design.Adc.ReferenceTempcoPerKelvin, ConverterErrors.CornersOf(design),
            !design.Adc.IsRatiometric && !design.Adc.ReferenceTempcoSigned);

    /// <summary>
    /// The converter's LSB with its reference at <paramref name="boardCelsius"/>, at corner <paramref name="corner"/>:
    /// a bound tempco lowers the reference (raising the code) at the upper corner and raises it at the lower.
    /// </summary>
    public double LsbVoltsAt(double boardCelsius, int corner)
    {
        var drift = TempcoIsBound
            ? (corner == 0 ? -1 : 1) * Math.Abs(ReferenceTempcoPerKelvin * (boardCelsius - 25))
            : ReferenceTempcoPerKelvin * (boardCelsius - 25);
        return ReferenceVolts * (1 + drift) / (1 << Bits);
    }
}
