using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>What a current-excited design's network gives at one temperature: what the converter converts (its positive input less its negative), its reference, and the source's output.</summary>
internal readonly record struct CurrentNetworkVolts(double PinVolts, double ReferenceVolts, double SourceVolts);

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

    /// <summary>
    /// The network solved by hand (Kirchhoff's laws), with <paramref name="drawnAmperes"/> drawn by the converter's
    /// positive input (through the filter's series resistor) and the leads of <paramref name="withLeads"/>. The source's
    /// current I_s splits between its output resistance and the chain (reference resistor R_r, then the chain R_t from its
    /// top to ground: lead, sensor, return lead); the chain current is I_r = (I_s·R_out + I_l·R_x − I₂·R_ret)/(R_t + R_r + R_out)
    /// (I_s for an ideal source), R_x being what the drawn current sees of the chain (all of it with 2 or 3 wires, the
    /// sensor and the return lead with 4) and I₂ the second current of 3 wires. The converter converts
    /// 2 wires: (I_r − I_l)·(R_s + 2·R_L); 3 wires: (I_r − I_l)·(R_L + R_s) − I₂·R_L; 4 wires: (I_r − I_l)·R_s − I_l·R_L;
    /// less I_l times the series resistor; its reference is I_r·R_r.
    /// </summary>
    public static CurrentNetworkVolts Network(FrontEndDesign design, double sensorOhms, double drawnAmperes, double boardCelsius, bool withLeads = true)
    {
        var source = design.CurrentSource!;
        var current = Amperes(source, boardCelsius);
        var reference = ReferenceOhms(source, boardCelsius);
        var output = source.OutputResistanceOhms ?? double.PositiveInfinity;
        var wiring = withLeads ? design.Wiring : null;
        var wires = wiring?.Wires ?? 2;
        var lead = wiring?.LeadOhmsAt(wiring.LeadCelsius ?? boardCelsius) ?? 0;
        var second = wires == 3 ? current * (1 + wiring!.CurrentMismatch) : 0;
        var chain = lead + sensorOhms + lead;
        var seen = wires == 4 ? sensorOhms + lead : chain;
        var (s, l) = (current, drawnAmperes);
        var through = double.IsInfinity(output) ? s : (s * output + l * seen - second * lead) / (chain + reference + output);
        double pin, top;
        if (wires == 4)
        {
            pin = (through - l) * sensorOhms - l * lead;
            top = through * chain - l * seen;
        }
        else
        {
            top = (through - l) * chain + second * lead;
            var negative = wires == 3 ? second * lead + (through - l + second) * lead : 0;
            pin = top - negative;
        }
        return new CurrentNetworkVolts(pin - l * design.Filter.SeriesResistorOhms, through * reference, top + through * reference);
    }
}
