using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>What a current-excited sensor's network gives at one temperature (volts, against ground).</summary>
internal readonly record struct CurrentNetworkVolts(double SensorVolts, double ReferenceVolts, double SourceVolts);

/// <summary>
/// A current through the sensor, by Ohm's law: the firmware's model V = I·R_s (so R_s = V/I, and with a reference
/// resistor the code is 2^N·R_s/R_ref, the current cancelling), and the network as built, solved by hand: the source's
/// current I_s with its output resistance R_out to ground, the reference resistor R_r (in parallel with the converter's
/// reference input) between the source and the sensor, the sensor to ground, and a current I_l drawn from the sensor's
/// node (pin leakage). Superposition of the two currents (Kirchhoff's laws): the chain carries I_s·R_out/(R_out + R_r + R_s);
/// I_l sees R_s ∥ (R_r + R_out) and draws I_l·R_s/(R_s + R_r + R_out) of itself through R_r.
/// </summary>
internal static class CurrentFormula
{
    public static double OutputVolts(double amperes, double sensorOhms) => amperes * sensorOhms;

    /// <summary>R_s = V/I; NaN where no sensor gives the voltage (zero or below).</summary>
    public static double SensorOhms(double amperes, double volts) => volts > 0 ? volts / amperes : double.NaN;

    /// <summary>The resistance the sensor's node sees: R_s ∥ (R_r + R_out), R_s itself for an ideal source.</summary>
    public static double TheveninOhms(CurrentSourceSpec source, double sensorOhms, double boardCelsius)
    {
        if (source.OutputResistanceOhms is not { } output) return sensorOhms;
        var other = ReferenceOhms(source, boardCelsius) + output;
        return sensorOhms * other / (sensorOhms + other);
    }

    /// <summary>The reference resistor at the board temperature, in parallel with the reference input; 0 without one.</summary>
    public static double ReferenceOhms(CurrentSourceSpec source, double boardCelsius)
    {
        if (source.ReferenceResistorOhms is not { } r) return 0;
        var drifted = r * (1 + source.ReferenceResistorTempcoPerKelvin * (boardCelsius - 25));
        return source.ReferenceInputOhms is { } input ? drifted * input / (drifted + input) : drifted;
    }

    /// <summary>The source's current at the board temperature.</summary>
    public static double Amperes(CurrentSourceSpec source, double boardCelsius) =>
        source.CurrentAmperes * (1 + source.CurrentTempcoPerKelvin * (boardCelsius - 25));

    /// <summary>The network solved by superposition, with <paramref name="drawnAmperes"/> drawn from the sensor's node.</summary>
    public static CurrentNetworkVolts Network(CurrentSourceSpec source, double sensorOhms, double drawnAmperes, double boardCelsius)
    {
        var current = Amperes(source, boardCelsius);
        var reference = ReferenceOhms(source, boardCelsius);
        var output = source.OutputResistanceOhms ?? double.PositiveInfinity;
        var chain = double.IsInfinity(output) ? current : current * output / (output + reference + sensorOhms);
        var share = double.IsInfinity(output) ? 0 : sensorOhms / (sensorOhms + reference + output);
        var sensor = chain * sensorOhms - drawnAmperes * TheveninOhms(source, sensorOhms, boardCelsius);
        var across = chain * reference + drawnAmperes * share * reference;
        return new CurrentNetworkVolts(sensor, across, sensor + across);
    }
}
