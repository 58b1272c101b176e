using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// Builds the netlists of a design: excitation, divider, optional buffer, optional filter and reservoir, and the
/// ADC input (pin capacitance, pin leakage, sampling switch and capacitor). One builder, two uses: the DC circuit
/// for the temperature sweep (sampling replaced by its average current) and the sampling circuit for transients.
/// </summary>
internal static class FrontEndCircuit
{
    /// <summary>Off resistance of the ideal switches: an open switch, but a DC path for the solver.</summary>
    public const double SwitchOffOhms = 1e12;

    /// <summary>
    /// Time constants the precharge switch gets within its window: e^−40 leaves nothing measurable, and a slower
    /// switch than a near-short keeps the transient free of picosecond steps.
    /// </summary>
    private const double PrechargeTimeConstants = 40;

    // A zero-ohm sampling switch is allowed in the design (ideal); the solver needs a finite conductance.
    private const double MinimumSwitchOhms = 1e-3;

    /// <summary>
    /// The DC circuit at 25 °C: every element the design gives, with periodic sampling replaced by its average
    /// current, a resistor R_eq = 1/(f_s·C_sh) from the pin to the precharge level (Johns &amp; Martin). With
    /// "last-sample" precharge the average current is zero in the steady state, so no resistor is added.
    /// </summary>
    /// <param name="celsius">
    /// The temperature the circuit is built for, when it is built for one (the op-amp's offset drifts to it when the
    /// design gives no board temperature); null for a circuit swept over temperature.
    /// </param>
    public static Circuit Dc(FrontEndDesign design, double? prechargeVolts, double? celsius = null)
    {
        var elements = Front(design, celsius);
        // Behind a gain stage the acquisition draws its charge from the amplifier, not from the pin.
        if (prechargeVolts is { } pre && design.Adc.GainStage is null)
        {
            elements.Add(new VoltageSource("Vprecharge", Precharge, Circuit.Ground, new DcWaveform(pre)));
            elements.Add(new Resistor("Rsampling", PinNode(design), Precharge, 1 / (design.Adc.SampleRateHertz * design.Adc.SamplingCapacitanceFarads)));
        }
        return new Circuit(elements, celsius ?? 25);
    }

    /// <summary>
    /// The sampling circuit. Conversion k acquires during [(k+1)·T − t_acq, (k+1)·T): the sampling switch joins
    /// the pin to the sampling capacitor, which is read when the switch opens at (k+1)·T. When a precharge level is
    /// given, a second switch holds the capacitor at it from k·T until a short gap before each acquisition
    /// (the multiplexer has just converted another channel, or the converter discharges the capacitor).
    /// </summary>
    public static Circuit Sampling(FrontEndDesign design, double? prechargeVolts, int conversions, double? celsius = null)
    {
        var adc = design.Adc;
        var period = 1 / adc.SampleRateHertz;
        var elements = Front(design, celsius);
        if (adc.ChargeInjectionCoulombs != 0)
            ChargeInjection.Add(elements, design, conversions);
        elements.Add(new Capacitor("Csample", Hold, Circuit.Ground, adc.SamplingCapacitanceFarads));
        elements.Add(new TimedSwitch(SamplingSwitch, SampledNode(design, elements), Hold, Math.Max(adc.SwitchResistanceOhms, MinimumSwitchOhms), SwitchOffOhms,
            new PeriodicSchedule(period - adc.AcquisitionTimeSeconds, period, adc.AcquisitionTimeSeconds, conversions)));
        if (prechargeVolts is { } pre)
        {
            var window = period - adc.AcquisitionTimeSeconds - PrechargeGapSeconds(design);
            var onOhms = window / (PrechargeTimeConstants * adc.SamplingCapacitanceFarads);
            elements.Add(new VoltageSource("Vprecharge", Precharge, Circuit.Ground, new DcWaveform(pre)));
            elements.Add(new TimedSwitch(PrechargeSwitch, Precharge, Hold, onOhms, SwitchOffOhms,
                new PeriodicSchedule(0, period, window, conversions)));
        }
        if (adc.NegativeInput is { } negative)
        {
            // The negative input samples the bridge's second output at the same instants, onto its own capacitor
            // through its own switch, precharged as the positive input is: the converter converts v(hold) − v(holdn).
            elements.Add(new Capacitor("Csamplen", HoldNegative, Circuit.Ground, negative.SamplingCapacitanceFarads));
            elements.Add(new TimedSwitch(NegativeSamplingSwitch, NegativeNode(design), HoldNegative, Math.Max(negative.SwitchResistanceOhms, MinimumSwitchOhms), SwitchOffOhms,
                new PeriodicSchedule(period - adc.AcquisitionTimeSeconds, period, adc.AcquisitionTimeSeconds, conversions)));
            // Its own fixed level where the design gives one, else the positive input's precharge.
            var negativeLevel = negative.PrechargeVolts is null ? prechargeVolts is null ? null : Precharge : NegativePrecharge;
            if (negative.PrechargeVolts is { } level)
                elements.Add(new VoltageSource("Vprechargen", NegativePrecharge, Circuit.Ground, new DcWaveform(level)));
            if (negativeLevel is { } from)
            {
                var window = period - adc.AcquisitionTimeSeconds - PrechargeGapSeconds(design);
                elements.Add(new TimedSwitch(NegativePrechargeSwitch, from, HoldNegative, window / (PrechargeTimeConstants * negative.SamplingCapacitanceFarads),
                    SwitchOffOhms, new PeriodicSchedule(0, period, window, conversions)));
            }
        }
        return new Circuit(elements, celsius ?? 25);
    }

    /// <summary>
    /// The node the sampling switch takes its charge from: the pin, or with a gain stage the amplifier's output. The
    /// amplifier is an ideal voltage-controlled source of gain 1 from the pin: every analysis works on the pin's scale
    /// (full scale V_ref/G), where the amplifier's output G·V_pin reads as V_pin, and what matters physically is that
    /// the acquisition's charge comes from its output, not from the pin (the pin sees its input current alone). Its gain
    /// error is the converter's business (ConverterErrors), not the circuit's.
    /// </summary>
    private static string SampledNode(FrontEndDesign design, List<Element> elements)
    {
        if (design.Adc.GainStage is null) return PinNode(design);
        elements.Add(new Vcvs(GainStageElement, GainStageOutput, Circuit.Ground, PinNode(design), Circuit.Ground, 1));
        return GainStageOutput;
    }

    /// <summary>Time between the precharge switch opening and the sampling switch closing.</summary>
    public static double PrechargeGapSeconds(FrontEndDesign design) =>
        0.01 * (1 / design.Adc.SampleRateHertz - design.Adc.AcquisitionTimeSeconds);

    /// <summary>
    /// The time at which conversion k (from 0) is taken: the sampling switch's own opening edge, computed exactly as its
    /// schedule computes it (close = delay + k·period with delay = period − t_acq, open = close + t_acq). A sample time
    /// written another way, (k + 1)/f_s, can differ from the edge in the last bit, and a read or a run's end placed by
    /// one formula then fell a rounding outside what the other had simulated; every sample instant, stop time and
    /// recorded window end comes from here.
    /// </summary>
    public static double SampleTimeSeconds(FrontEndDesign design, int conversion)
    {
        var period = 1 / design.Adc.SampleRateHertz;
        var acquisition = design.Adc.AcquisitionTimeSeconds;
        return period - acquisition + conversion * period + acquisition;
    }

    /// <summary>Excitation, divider, buffer, filter and the static part of the ADC input.</summary>
    private static List<Element> Front(FrontEndDesign design, double? celsius)
    {
        var board = design.Check.BoardCelsius;
        var elements = new List<Element>();
        if (design.Netlist is not null)
        {
            NetlistCircuit.Add(elements, design, board);
        }
        else if (design.CurrentSource is not null)
        {
            CurrentSourceCircuit.Add(elements, design, board, celsius);
        }
        else
        {
            var divider = design.VoltageDivider;
            var high = divider.SensorSide == SensorSide.High;
            var fixedNodes = high ? (Divider, Circuit.Ground) : (Excitation, Divider);
            elements.Add(new VoltageSource("Vexc", Excitation, Circuit.Ground, new DcWaveform(divider.ExcitationVolts)));
            var (top, bottom) = high ? (Excitation, Divider) : (Divider, Circuit.Ground);
            if (design.Wiring is { Wires: 3 } armLeads)
                // 3 wires in a bridge: a lead in each arm and one in the sense line (its own closed form and circuit).
                BridgeArmLeads.Add(elements, design, armLeads, board);
            else if (design.Wiring is { LeadOhms: > 0 } wiring)
            {
                // Two wires: both leads in the sensor's arm, R_s + 2·R_L at the leads' own temperature.
                elements.Add(new SensorResistor(SensorElement, SensorTop, SensorBottom, design.Sensor.Build()));
                elements.Add(LeadResistor(wiring, "Rlead1", top, SensorTop, board));
                elements.Add(LeadResistor(wiring, "Rlead2", SensorBottom, bottom, board));
            }
            else
                elements.Add(new SensorResistor(SensorElement, top, bottom, design.Sensor.Build()));
            if (design.Wiring is not { Wires: 3 })
                elements.Add(FixedResistor(FixedElement, fixedNodes.Item1, fixedNodes.Item2, divider.FixedResistorOhms, divider.FixedTempcoPerKelvin, board));
            if (design.Bridge is { } bridge)
            {
                // The bridge's opposite half across the same excitation: its midpoint is the converter's negative input,
                // which draws no current of its own here (the converter reads it at its DC level).
                elements.Add(FixedResistor(BridgeHighElement, Excitation, BridgeNegative, bridge.HighOhms, bridge.HighTempcoPerKelvin, board));
                elements.Add(FixedResistor(BridgeLowElement, BridgeNegative, Circuit.Ground, bridge.LowOhms, bridge.LowTempcoPerKelvin, board));
            }
        }

        if (design.Buffer is { } buffer)
            BufferStage.Add(elements, buffer, Divider, board, celsius);
        if (design.Amplifier is { } amplifier)
            AmplifierStage.Add(elements, amplifier, board, celsius);
        var pin = PinNode(design);
        if (design.Filter.SeriesResistorOhms > 0)
            elements.Add(new Resistor("Rfilter", DriveNode(design), Pin, design.Filter.SeriesResistorOhms));
        if (design.Filter.ReservoirCapacitorFarads > 0)
            elements.Add(new Capacitor("Creservoir", pin, Circuit.Ground, design.Filter.ReservoirCapacitorFarads));
        if (design.Adc.PinCapacitanceFarads > 0)
            elements.Add(new Capacitor("Cpin", pin, Circuit.Ground, design.Adc.PinCapacitanceFarads));
        if (design.Adc.PinLeakageAmperes != 0)
            elements.Add(Leakage(pin, design.Adc, board));
        if (design.Adc.NegativeInput is { } negativeInput)
        {
            // The negative input's own pin: its capacitance and leakage at the bridge's second output.
            if (negativeInput.PinCapacitanceFarads > 0)
                elements.Add(new Capacitor("Cpinn", NegativeNode(design), Circuit.Ground, negativeInput.PinCapacitanceFarads));
            if (negativeInput.PinLeakageAmperes != 0)
                elements.Add(board is { } b
                    ? new CurrentSource("Ileakn", NegativeNode(design), Circuit.Ground, new DcWaveform(design.Adc.NegativeLeakageAmperesAt(b)))
                    : new LeakageCurrentSource("Ileakn", NegativeNode(design), Circuit.Ground, design.Adc.NegativeLeakageAmperesAt(25), design.Adc.LeakageDoublingKelvin));
        }
        // The gain stage's input current, positive into its input (pulling the pin down, as the pin leakage).
        if (design.Adc.GainStage is { InputCurrentAmperes: not 0 } stage)
            elements.Add(new CurrentSource(GainStageInputElement, pin, Circuit.Ground, new DcWaveform(stage.InputCurrentAmperes)));
        ProtectionCircuit.Add(elements, design, pin);
        // With nothing else at the pin, the series resistor alone would leave it floating in the DC circuit: the
        // converter's input is there, with its sampling switch open (the sampling circuit's off resistance).
        // So would an amplifier's output with nothing behind it, and the sense lead of a 3-wire bridge.
        if ((pin == Pin || design.Amplifier is not null || design.Wiring is { Wires: 3 } && design.CurrentSource is null)
            && elements.Count(e => e.Nodes.Contains(pin)) == 1)
            elements.Add(new Resistor("Rinput", pin, Circuit.Ground, SwitchOffOhms));
        return elements;
    }

    /// <summary>
    /// The reservoir at the pin: the filter's, or in a netlist the capacitors from the pin to ground (what holds the pin
    /// between samples; a capacitor further back is behind a resistance and counts through the transient alone).
    /// </summary>
    public static double ReservoirFarads(FrontEndDesign design) => design.Netlist is { } n
        ? n.Parsed.Elements.Where(e => e.Kind == 'C' && e.Nodes.Contains(n.PinNode) && e.Nodes.Contains(Circuit.Ground)).Sum(e => e.Value)
        : design.Filter.ReservoirCapacitorFarads;

    /// <summary>The node that drives the filter: the buffer's output, or the divider itself.</summary>
    public static string DriveNode(FrontEndDesign design) =>
        design.Amplifier is not null ? AmplifierOutput : design.Buffer is null ? Divider : BufferOutput;

    /// <summary>The op-amp's own output (before any isolation resistor); the divider when there is no buffer.</summary>
    public static string AmplifierNode(FrontEndDesign design) =>
        design.Amplifier is not null ? AmplifierOutput
        : design.Buffer is null ? Divider : design.Buffer.IsolationResistorOhms > 0 ? BufferStage.AmplifierOutput : BufferOutput;

    /// <summary>The node a differential input's negative side reads: a netlist's negative_pin, else the bridge's second output.</summary>
    public static string NegativeNode(FrontEndDesign design) => design.Netlist?.NegativePinNode ?? BridgeNegative;

    /// <summary>The ADC pin: its own node behind a series resistor, else the drive node itself.</summary>
    public static string PinNode(FrontEndDesign design) =>
        design.Netlist?.PinNode ?? (design.Filter.SeriesResistorOhms > 0 ? Pin : DriveNode(design));

    /// <summary>A resistor on the board (the fixed or the reference resistor): its tempco follows the sweep, or is taken once at the board temperature.</summary>
    internal static Resistor FixedResistor(string name, string a, string b, double ohms, double tempco, double? boardCelsius) =>
        boardCelsius is { } board
            ? new Resistor(name, a, b, ohms * (1 + tempco * (board - 25)))
            : new Resistor(name, a, b, ohms, tempco);

    /// <summary>
    /// One lead of the sensor's wiring: at the leads' own temperature, or with the board (fixed or following the sweep).
    /// A lead of 0 Ω (allowed in the design, and the end of a remedy's search) is simulated as 1 mΩ where the wiring
    /// needs its nodes (a current source's 3 or 4 wires; a divider's sensor then has no leads at all): a resistor needs a
    /// resistance, and a smaller one leaves the matrix ill-conditioned. 2 mΩ moves a Pt100 by 5 mK.
    /// </summary>
    internal static Resistor LeadResistor(WiringSpec wiring, string name, string a, string b, double? boardCelsius)
    {
        var ohms = Math.Max(wiring.LeadOhms, MinimumLeadOhms);
        return wiring.LeadCelsius is { } t
            ? new Resistor(name, a, b, ohms * (1 + wiring.LeadTempcoPerKelvin * (t - 25)))
            : FixedResistor(name, a, b, ohms, wiring.LeadTempcoPerKelvin, boardCelsius);
    }

    private const double MinimumLeadOhms = 1e-3;

    /// <summary>Pin leakage, positive into the pin: it follows the sweep (doubling every N K) or sits at the board temperature.</summary>
    private static Element Leakage(string pin, AdcSpec adc, double? boardCelsius)
    {
        return boardCelsius is { } board
            ? new CurrentSource("Ileak", pin, Circuit.Ground, new DcWaveform(adc.PinLeakageAmperesAt(board)))
            : new LeakageCurrentSource("Ileak", pin, Circuit.Ground, adc.PinLeakageAmperesAt(25), adc.LeakageDoublingKelvin);
    }
}
