using System.Globalization;
using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The ADC transfer function thermverify assumes, and the firmware's inverse of it. Q = V_ref/2^N. With the first
/// transition at t₁ (½ or 1 LSB) bin k spans (k − 1 + t₁)·Q to (k + t₁)·Q, so code = floor(V/Q + 1 − t₁) clamped to
/// 0 … 2^N − 1 (the two end codes collect every voltage beyond them); the firmware maps a code back to the bin's middle,
/// (k − ½ + t₁)·Q, or its lower edge, (k − 1 + t₁)·Q. The defaults, t₁ = ½ LSB and the middle, give round(V/Q) and
/// code·Q: quantisation error uniform on ±Q/2 (IEEE Std 1241).
/// </summary>
public readonly record struct AdcTransfer(int Bits, double ReferenceVolts)
{
    /// <summary>
    /// The nominal converter of a design as its firmware sees it, referred to the pin (reference: the excitation of a
    /// ratiometric divider, I·R_ref with a reference resistor; over the programmable gain when there is one).
    /// </summary>
    public static AdcTransfer Of(FrontEndDesign design) =>
        new(design.Adc.Bits, design.FullScaleAtPinVolts)
        {
            FirstTransition = design.Adc.FirstTransition,
            Inverse = design.Adc.FirmwareInverse,
            Bipolar = design.Adc.IsBipolar,
        };

    /// <summary>Signed codes (a differential input): −2^(N−1) .. 2^(N−1) − 1, two's complement, the same Q = V_ref/2^N.</summary>
    public bool Bipolar { get; init; }

    /// <summary>The lowest code: 0, or −2^(N−1) for signed codes.</summary>
    public int MinCode => Bipolar ? -(1 << (Bits - 1)) : 0;

    public FirstTransition FirstTransition { get; init; }

    public CodeInverse Inverse { get; init; }

    public int MaxCode => Bipolar ? (1 << (Bits - 1)) - 1 : (1 << Bits) - 1;

    /// <summary>Q, one LSB in volts.</summary>
    public double LsbVolts => ReferenceVolts / (1 << Bits);

    /// <summary>t₁ in LSB.</summary>
    public double FirstTransitionLsb => FirstTransition == FirstTransition.HalfLsb ? 0.5 : 1.0;

    /// <summary>Where in its bin the firmware puts a code, in LSB from the code itself: (t₁ − ½) for the middle, (t₁ − 1) for the lower edge.</summary>
    public double InverseOffsetLsb => FirstTransitionLsb - (Inverse == CodeInverse.BinMiddle ? 0.5 : 1.0);

    /// <summary>The exact (unquantised) code scale of a voltage: V/Q.</summary>
    public double IdealCode(double volts) => volts / LsbVolts;

    public int Code(double volts) => Quantise(volts / LsbVolts);

    /// <summary>The code of an unrounded value on the V/Q scale (an ideal code, or one bent by the converter's own errors).</summary>
    public int Quantise(double unroundedCode)
    {
        var code = Math.Floor(unroundedCode + 1 - FirstTransitionLsb);
        return double.IsNaN(code) ? MinCode : (int)Math.Clamp(code, MinCode, MaxCode);
    }

    /// <summary>The voltage the firmware takes a code (whole or fractional) to stand for.</summary>
    public double VoltsOf(double code) => (code + InverseOffsetLsb) * LsbVolts;

    /// <summary>The code, fractional, whose firmware voltage is <paramref name="volts"/>: the inverse of <see cref="VoltsOf"/>.</summary>
    public double CodeReadAs(double volts) => volts / LsbVolts - InverseOffsetLsb;

    /// <summary>The voltages bounding a code's bin: (k − 1 + t₁)·Q and (k + t₁)·Q.</summary>
    public (double LowVolts, double HighVolts) BinVolts(int code) =>
        ((code - 1 + FirstTransitionLsb) * LsbVolts, (code + FirstTransitionLsb) * LsbVolts);

    /// <summary>The convention in words, for reports, JSON and headers.</summary>
    public string Describe() =>
        string.Create(CultureInfo.InvariantCulture,
            $"Q = Vref/2^N; first transition at {(FirstTransition == FirstTransition.HalfLsb ? "1/2" : "1")} LSB, code = " +
            $"{(FirstTransition == FirstTransition.HalfLsb ? "round(V/Q)" : "floor(V/Q)")} clamped to {(Bipolar ? "-2^(N-1)..2^(N-1)-1 (V = V+ - V-, signed)" : "0..2^N-1")}; firmware reads a code as " +
            $"{(Inverse == CodeInverse.BinMiddle ? "the middle" : "the lower edge")} of its bin, V = {Formula()}");

    private string Formula() => InverseOffsetLsb switch
    {
        0 => "code*Q",
        > 0 => string.Create(CultureInfo.InvariantCulture, $"(code + {InverseOffsetLsb:0.#})*Q"),
        _ => string.Create(CultureInfo.InvariantCulture, $"(code - {-InverseOffsetLsb:0.#})*Q"),
    };
}
