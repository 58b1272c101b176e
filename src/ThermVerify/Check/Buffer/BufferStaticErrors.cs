using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check.Buffer;

/// <summary>The buffer's static error at the ADC pin at one temperature, by cause (volts, then LSB and K of the total).</summary>
public sealed record StaticErrorPoint(
    double Celsius,
    double OffsetVolts,
    double DriftVolts,
    double BiasVolts,
    double SourceOhms,
    double TotalVolts,
    double TotalLsb,
    double TotalKelvin);

/// <summary>
/// The closed form of the buffer's static errors, by Ohm's law, at the output of the buffer (so at the pin, before the
/// filter's own loading). Offset: G·V_os. Drift: G·(dV_os/dT)·(T_op − 25 °C), with the op-amp at the board temperature
/// when the design gives one and at the swept temperature otherwise (the whole unit in the same environment), as the
/// simulation holds it. Bias: the current into the non-inverting pin, I_b + I_os/2, drawn through the divider's
/// Thevenin resistance R_th(T) pulls the input down by I·R_th; for a non-inverting stage the inverting pin's current
/// I_b − I_os/2 flows through the feedback resistor and raises the output by I·R_f. The check's buffer column is the
/// simulated value; this is the estimate printed beside it.
/// </summary>
internal static class BufferStaticErrors
{
    public static IReadOnlyList<StaticErrorPoint> Run(FrontEndDesign design, IReadOnlyList<double> temperaturesCelsius)
    {
        var model = new ClosedFormModel(design);
        return [.. temperaturesCelsius.Select(t => At(design, model.At(t), model))];
    }

    public static StaticErrorPoint At(FrontEndDesign design, ClosedFormPoint cf, ClosedFormModel? model = null)
    {
        var b = BufferCircuits.Require(design);
        model ??= new ClosedFormModel(design);
        var plusAmps = b.BiasCurrentAmperes + b.OffsetCurrentAmperes / 2;
        var minusAmps = b.BiasCurrentAmperes - b.OffsetCurrentAmperes / 2;
        var feedbackOhms = b.Topology == BufferTopology.NonInverting ? (b.Gain - 1) * BufferStage.GroundLegOhms : 0;
        var operating = design.Check.BoardCelsius ?? cf.Celsius;
        var offset = b.Gain * b.OffsetVolts;
        var drift = b.Gain * b.OffsetDriftVoltsPerKelvin * (operating - 25);
        var bias = -b.Gain * plusAmps * cf.TheveninOhms + minusAmps * feedbackOhms;
        var total = offset + drift + bias;
        var kelvin = model.CelsiusAtVolts(cf.IdealVolts + total) - cf.Celsius;
        return new StaticErrorPoint(cf.Celsius, offset, drift, bias, cf.TheveninOhms, total, total / model.Adc.LsbVolts, kelvin);
    }
}
