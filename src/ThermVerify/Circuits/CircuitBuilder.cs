namespace ThermVerify.Circuits;

/// <summary>Collects elements fluently; <see cref="Build"/> validates them into a <see cref="Circuit"/>.</summary>
internal sealed class CircuitBuilder
{
    private readonly List<Element> elements = [];
    private double temperatureCelsius = 25;

    public CircuitBuilder Add(Element element)
    {
        elements.Add(element);
        return this;
    }

    public CircuitBuilder At(double temperatureCelsius)
    {
        this.temperatureCelsius = temperatureCelsius;
        return this;
    }

    public CircuitBuilder Resistor(string name, string a, string b, double ohms) => Add(new Resistor(name, a, b, ohms));

    public CircuitBuilder Capacitor(string name, string a, string b, double farads, double? initialVoltage = null) =>
        Add(new Capacitor(name, a, b, farads, initialVoltage));

    public CircuitBuilder Inductor(string name, string a, string b, double henries) => Add(new Inductor(name, a, b, henries));

    public CircuitBuilder VoltageSource(string name, string positive, string negative, Waveform waveform, double acMagnitude = 0) =>
        Add(new VoltageSource(name, positive, negative, waveform, acMagnitude));

    public CircuitBuilder CurrentSource(string name, string positive, string negative, Waveform waveform, double acMagnitude = 0) =>
        Add(new CurrentSource(name, positive, negative, waveform, acMagnitude));

    public CircuitBuilder Switch(string name, string a, string b, double onOhms, double offOhms, SwitchSchedule schedule) =>
        Add(new TimedSwitch(name, a, b, onOhms, offOhms, schedule));

    public Circuit Build() => new(elements, temperatureCelsius);
}
