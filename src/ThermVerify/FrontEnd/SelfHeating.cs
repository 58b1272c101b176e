using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.FrontEnd;

/// <summary>The sensor's own heating over the check range.</summary>
internal sealed record SelfHeatingProfile(
    IReadOnlyList<double> Celsius,
    IReadOnlyList<double> PowerWatts,
    IReadOnlyList<double> RiseKelvin,
    double DutyCycle,
    double? DissipationConstantWattsPerKelvin);

/// <summary>
/// Self-heating in the terms of IEC 60539-1: the sensor dissipates P = V²/R at its simulated operating point and
/// warms by ΔT = P/δ over its surroundings, δ being the dissipation constant. With a switched excitation the sensor
/// is powered for the switch-on lead and one conversion in every reading interval; its thermal time constant is
/// taken as much longer than the interval, so the mean power counts (P times the duty cycle).
/// </summary>
internal static class SelfHeating
{
    /// <summary>Fraction of the time the divider is excited: 1 unless the design switches it.</summary>
    public static double DutyCycle(FrontEndDesign design)
    {
        var lead = SwitchOnSettling.LeadSeconds(design);
        var interval = design.Divider?.ReadingIntervalSeconds ?? design.Netlist?.ReadingIntervalSeconds;
        if (lead is null || interval is null) return 1;
        return Math.Min(1, (lead.Value + 1 / design.Adc.SampleRateHertz) / interval.Value);
    }

    /// <summary>Sensor power at each temperature from the divider voltages of a simulated DC sweep.</summary>
    public static double[] PowerWatts(FrontEndDesign design, ISensorModel sensor, IReadOnlyList<double> celsius, IReadOnlyList<double> dividerVolts)
    {
        var power = new double[celsius.Count];
        // A current source drives the sensor from its node to ground, as the low side of a divider.
        var high = design.Divider?.SensorSide == SensorSide.High;
        for (var i = 0; i < power.Length; i++)
        {
            var across = high ? design.VoltageDivider.ExcitationVolts - dividerVolts[i] : dividerVolts[i];
            power[i] = across * across / sensor.ResistanceOhms(celsius[i]);
        }
        return power;
    }

    /// <summary>ΔT = duty·P/δ at each temperature; zeros when the design gives no dissipation constant.</summary>
    public static double[] RiseKelvin(FrontEndDesign design, IReadOnlyList<double> powerWatts)
    {
        var rise = new double[powerWatts.Count];
        if (design.Sensor.DissipationConstantWattsPerKelvin is not { } delta) return rise;
        var duty = DutyCycle(design);
        for (var i = 0; i < rise.Length; i++)
            rise[i] = duty * powerWatts[i] / delta;
        return rise;
    }

    /// <summary>
    /// What the warming does at the pin: ΔT·dV/dT of the divider (times the buffer gain), first order; the warmer
    /// sensor reads high. The second-order term, ½·ΔT·|d ln(dV/dT)/dT|, is 0.2 % of a 0.1 K rise on a 10 kΩ NTC divider.
    /// </summary>
    public static double[] PinVolts(FrontEndDesign design, ISensorModel sensor, IReadOnlyList<double> celsius, IReadOnlyList<double> dividerVolts)
    {
        var rise = RiseKelvin(design, PowerWatts(design, sensor, celsius, dividerVolts));
        var volts = new double[rise.Length];
        for (var i = 0; i < volts.Length; i++)
        {
            if (rise[i] == 0) continue;
            var r = sensor.ResistanceOhms(celsius[i]);
            volts[i] = rise[i] * design.StageGain * SensorTransfer.SlopeVoltsPerOhm(design, r)
                       * sensor.SlopeOhmsPerKelvin(celsius[i]);
        }
        return volts;
    }

    /// <summary>The nominal design's profile over its check grid, from the simulated DC sweep.</summary>
    public static SelfHeatingProfile Profile(FrontEndDesign design)
    {
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var divider = DcLevels.Run(design, [], temperatures).DividerVolts;
        var power = PowerWatts(design, design.Sensor.Build(), temperatures, divider);
        return new SelfHeatingProfile(temperatures, power, RiseKelvin(design, power), DutyCycle(design), design.Sensor.DissipationConstantWattsPerKelvin);
    }
}
