namespace ThermVerify.FrontEnd;

/// <summary>
/// The ideal ADC transfer function thermverify assumes, and the firmware's inverse of it.
/// Convention (IEEE Std 1241 ideal converter with the first code transition at ½ LSB): Q = V_ref/2^N,
/// code = round(V/Q) clamped to 0 … 2^N − 1; the firmware maps a code back to V = code·Q, the centre of its bin,
/// so the quantisation error is uniform on ±Q/2.
/// </summary>
public readonly record struct AdcTransfer(int Bits, double ReferenceVolts)
{
    public int MaxCode => (1 << Bits) - 1;

    /// <summary>Q, one LSB in volts.</summary>
    public double LsbVolts => ReferenceVolts / (1 << Bits);

    /// <summary>The exact (unquantised) code a voltage corresponds to: V/Q.</summary>
    public double IdealCode(double volts) => volts / LsbVolts;

    public int Code(double volts) => (int)Math.Clamp(Math.Round(volts / LsbVolts, MidpointRounding.AwayFromZero), 0, MaxCode);

    public double VoltsOf(double code) => code * LsbVolts;
}
