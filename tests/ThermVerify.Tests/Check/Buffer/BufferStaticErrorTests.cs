using ThermVerify.Check.Buffer;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Check.Buffer;

public class BufferStaticErrorTests
{
    private static double SensorOhms(double celsius) => 10e3 * Math.Exp(3435 * (1 / (celsius + 273.15) - 1 / 298.15));

    [Theory]
    [InlineData(-20)]
    [InlineData(25)]
    [InlineData(80)]
    public void Follower_offset_drift_and_bias_follow_ohms_law(double celsius)
    {
        var design = BufferDesigns.Follower(("buffer.offset_voltage", "\"1 mV\""), ("buffer.offset_drift", "\"5 uV/K\""),
            ("buffer.bias_current", "\"10 nA\""), ("buffer.offset_current", "\"2 nA\""));
        var point = Assert.Single(BufferStaticErrors.Run(design, [celsius]));
        // Ohm's law: the non-inverting pin draws I_b + I_os/2 = 11 nA through the divider's Thevenin resistance.
        var rth = SensorOhms(celsius) * 10e3 / (SensorOhms(celsius) + 10e3);
        Tolerance.AssertClose(1e-3, point.OffsetVolts, 1e-12);
        Tolerance.AssertClose(5e-6 * (celsius - 25), point.DriftVolts, 1e-12, 1e-18);
        Tolerance.AssertClose(-11e-9 * rth, point.BiasVolts, 1e-12);

        // The engine's operating point of the circuit built for this temperature agrees (the op-amp there, without a
        // board temperature, so its offset drifted to it), with the follower's finite-gain factor A0/(1 + A0) for
        // A0 = 120 dB (negative feedback, elementary).
        var op = OperatingPoint.Solve(FrontEndCircuit.Dc(design, null, celsius));
        var ideal = 3.3 * SensorOhms(celsius) / (SensorOhms(celsius) + 10e3);
        const double a0 = 1e6;
        Tolerance.AssertClose(a0 / (1 + a0) * (ideal + point.OffsetVolts + point.DriftVolts + point.BiasVolts), op.Voltage(FrontEndNodes.BufferOutput), 0, 1e-9, "simulated output (V)");
        // The temperature sweep adds the drift by superposition through the simulated offset sensitivity: the same pin.
        var swept = DcLevels.Run(design, [PrechargeCase.LastSample], [celsius]);
        Tolerance.AssertClose(op.Voltage(FrontEndNodes.BufferOutput), swept.StaticPinVolts[0], 0, 1e-9, "swept pin (V)");
    }

    [Fact]
    public void Non_inverting_stage_adds_the_inverting_bias_through_the_feedback_resistor()
    {
        // Gain 2: R_f = 10 kΩ. V_out = G·(V_os − I₊·R_th) + I₋·R_f (Ohm's law at both inputs).
        var design = BufferDesigns.Follower(("buffer.topology", "\"non-inverting\""), ("buffer.gain", "2"), ("buffer.offset_voltage", "\"0.5 mV\""),
            ("buffer.bias_current", "\"20 nA\""), ("buffer.offset_current", "\"4 nA\""), ("divider.excitation", "\"1.5 V\""), ("adc.reference", "\"3.3 V\""));
        var point = Assert.Single(BufferStaticErrors.Run(design, [25.0]));
        var rth = 5e3;
        Tolerance.AssertClose(2 * 0.5e-3 - 2 * 22e-9 * rth + 18e-9 * 10e3, point.TotalVolts, 1e-12);
        // Finite gain: V_out = A0/(1 + A0·β)·(V₊ + V_os) with β = 1/2, so the ideal part carries the factor too (1e-6 relative at 120 dB).
        var op = OperatingPoint.Solve(FrontEndCircuit.Dc(design, null) with { TemperatureCelsius = 25 });
        Tolerance.AssertClose(point.TotalVolts, op.Voltage(FrontEndNodes.BufferOutput) - 2 * 0.75, 0, 5e-6, "simulated static error (V)");
    }
}
