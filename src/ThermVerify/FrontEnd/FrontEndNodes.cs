namespace ThermVerify.FrontEnd;

/// <summary>Node and element names of the circuits built from a design (also used in SPICE decks and reports).</summary>
internal static class FrontEndNodes
{
    /// <summary>Excitation: the top of the divider.</summary>
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

    /// <summary>What the sampling capacitor is precharged to before each acquisition.</summary>
    public const string Precharge = "pre";

    public const string SensorElement = "Rsensor";
    public const string FixedElement = "Rfixed";
    public const string SamplingSwitch = "Ssample";
    public const string PrechargeSwitch = "Sprecharge";
    public const string ExcitationSwitch = "Sexcitation";
}
