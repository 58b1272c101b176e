namespace ThermVerify.FrontEnd;

/// <summary>Node and element names of the circuits built from a design (also used in SPICE decks and reports).</summary>
internal static class FrontEndNodes
{
    /// <summary>Excitation: the top of the divider, or the current source's output above the reference resistor.</summary>
    public const string Excitation = "exc";

    /// <summary>The supply a switched divider's excitation switch connects to the divider.</summary>
    public const string Supply = "supply";

    /// <summary>The divider's midpoint, where the sensor meets the fixed resistor.</summary>
    public const string Divider = "div";

    /// <summary>The buffer's output (when there is a buffer).</summary>
    public const string BufferOutput = "buf";

    /// <summary>The ADC pin: after the filter, at the reservoir capacitor.</summary>
    public const string Pin = "pin";

    /// <summary>The sampling capacitor, behind the sampling switch.</summary>
    public const string Hold = "hold";

    /// <summary>A differential input's negative sampling capacitor, behind its own switch.</summary>
    public const string HoldNegative = "holdn";

    /// <summary>The negative sampling capacitor's own precharge level, where the design gives one.</summary>
    public const string NegativePrecharge = "pren";

    /// <summary>What the sampling capacitor is precharged to before each acquisition.</summary>
    public const string Precharge = "pre";

    /// <summary>The current source's tempco stage (a 1 Ω resistor carrying 1 A), in a sweep without a board temperature.</summary>
    public const string SourceTempco = "itc";

    /// <summary>The sensor's own terminals at the far end of its leads.</summary>
    public const string SensorTop = "sp";
    public const string SensorBottom = "sn";

    /// <summary>3 wires: the near end of the compensating lead, the converter's negative input.</summary>
    public const string Compensation = "cmp";

    /// <summary>4 wires: the near end of the force lead (the current's way in) and of the negative sense lead.</summary>
    public const string Force = "frc";
    public const string SenseNegative = "sns";

    /// <summary>The amplifier's output behind a bridge; and its inner nodes (offset, gain, common-mode stages; drift stage).</summary>
    public const string AmplifierOutput = "ina";
    public const string AmplifierOffsetInput = "inap";
    public const string AmplifierOffsetBase = "inos";
    public const string AmplifierDifferential = "inad";
    public const string AmplifierCommonMode = "inac";
    public const string AmplifierDriftStage = "atc";

    /// <summary>A bridge's opposite midpoint, the converter's negative input.</summary>
    public const string BridgeNegative = "opp";

    /// <summary>The rail the upper clamp diode goes to.</summary>
    public const string ClampRail = "clamp";
    /// <summary>The potential the insulation leaks to, when it is not ground.</summary>
    public const string InsulationPotential = "ins";

    /// <summary>3 wires in a bridge: the fixed resistor's end of the adjacent arm's lead (<see cref="BridgeArmLeads"/>).</summary>
    public const string AdjacentLead = "adj";

    /// <summary>The programmable-gain stage's output, which the sampling switch of a converter behind it takes its charge from.</summary>
    public const string GainStageOutput = "pga";

    public const string SensorElement = "Rsensor";
    public const string GainStageElement = "Epga";
    public const string GainStageInputElement = "Ipga";
    public const string CurrentSourceElement = "Iexc";
    public const string ReferenceResistorElement = "Rref";
    public const string FixedElement = "Rfixed";
    public const string BridgeHighElement = "Rbridgehi";
    public const string BridgeLowElement = "Rbridgelo";
    public const string SamplingSwitch = "Ssample";
    public const string PrechargeSwitch = "Sprecharge";
    public const string NegativeSamplingSwitch = "Ssamplen";
    public const string NegativePrechargeSwitch = "Sprechargen";
    public const string ExcitationSwitch = "Sexcitation";
}
