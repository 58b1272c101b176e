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
    public double Code(double idealCode, int bits)
    {
        var x = idealCode / (1 << bits);
        return idealCode * (1 + GainError) + OffsetLsb + InlBowLsb * 4 * x * (1 - x);
    }

    /// <summary>The cases a design's check covers: offset and gain at the sign written, INL as a bound (both signs).</summary>
    public static IReadOnlyList<ConverterErrors> CasesOf(AdcSpec adc) =>
        adc.InlLsb == 0
            ? [new(adc.OffsetErrorLsb, adc.GainError, 0)]
            : [new(adc.OffsetErrorLsb, adc.GainError, adc.InlLsb), new(adc.OffsetErrorLsb, adc.GainError, -adc.InlLsb)];
}

/// <summary>
/// The converter as built: its reference (the excitation when ratiometric), the reference's tempco at the board
/// temperature (a fixed reference only), and its static-error cases. Its LSB is what the code is a multiple of; the
/// firmware still reads codes with the nominal LSB, so a reference error shows as a gain error of the reading.
/// </summary>
internal sealed record Converter(int Bits, double ReferenceVolts, double ReferenceTempcoPerKelvin, IReadOnlyList<ConverterErrors> Cases)
{
    public static Converter Of(FrontEndDesign design) =>
        new(design.Adc.Bits, design.Adc.ReferenceVolts ?? design.Divider.ExcitationVolts,
            design.Adc.IsRatiometric ? 0 : design.Adc.ReferenceTempcoPerKelvin, ConverterErrors.CasesOf(design.Adc));

    /// <summary>The converter's LSB with its reference at <paramref name="boardCelsius"/>.</summary>
    public double LsbVoltsAt(double boardCelsius) =>
        ReferenceVolts * (1 + ReferenceTempcoPerKelvin * (boardCelsius - 25)) / (1 << Bits);
}
