using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>The unloaded divider and its inverse (Ohm's law), as hand calculations and firmware assume.</summary>
internal static class DividerFormula
{
    public static double OutputVolts(SensorSide side, double excitationVolts, double sensorOhms, double fixedOhms) =>
        side == SensorSide.Low
            ? excitationVolts * sensorOhms / (sensorOhms + fixedOhms)
            : excitationVolts * fixedOhms / (sensorOhms + fixedOhms);

    /// <summary>Sensor resistance from the divider output; NaN where the output cannot come from a real sensor.</summary>
    public static double SensorOhms(SensorSide side, double excitationVolts, double outputVolts, double fixedOhms)
    {
        if (outputVolts <= 0 || outputVolts >= excitationVolts) return double.NaN;
        return side == SensorSide.Low
            ? fixedOhms * outputVolts / (excitationVolts - outputVolts)
            : fixedOhms * (excitationVolts - outputVolts) / outputVolts;
    }

    /// <summary>Thevenin resistance seen from the ADC node: the two resistors in parallel.</summary>
    public static double TheveninOhms(double sensorOhms, double fixedOhms) => sensorOhms * fixedOhms / (sensorOhms + fixedOhms);

    /// <summary>dV/dR_sensor, for turning a voltage error into a resistance (and so temperature) error.</summary>
    public static double SlopeVoltsPerOhm(SensorSide side, double excitationVolts, double sensorOhms, double fixedOhms)
    {
        var sum = sensorOhms + fixedOhms;
        return side == SensorSide.Low
            ? excitationVolts * fixedOhms / (sum * sum)
            : -excitationVolts * fixedOhms / (sum * sum);
    }
}
