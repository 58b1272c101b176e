using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>
/// Loads a design file strictly: unknown keys, missing required keys, wrong units and impossible values
/// are all <see cref="DesignException"/>s with file, line, column and a hint. See docs/design-file.md.
/// </summary>
internal static class DesignLoader
{
    private static readonly string[] TopKeys = ["name", "description", "sensor", "divider", "buffer", "filter", "adc", "check", "tolerances"];

    public static FrontEndDesign Load(string path)
    {
        var full = Path.GetFullPath(path);
        string text;
        try
        {
            text = File.ReadAllText(full);
        }
        catch (IOException e)
        {
            throw new DesignException(path, 1, 1, "", $"cannot read the design file ({e.Message})", "Check the path.");
        }
        catch (UnauthorizedAccessException e)
        {
            throw new DesignException(path, 1, 1, "", $"cannot read the design file ({e.Message})", "Check the file's permissions.");
        }
        return Parse(text, path, Path.GetDirectoryName(full) ?? ".");
    }

    /// <param name="sourceName">Name used in error messages, usually the path as the user gave it.</param>
    /// <param name="baseDirectory">Folder that relative paths in the design are resolved against (and must stay inside).</param>
    public static FrontEndDesign Parse(string text, string sourceName, string baseDirectory)
    {
        var root = TomlSection.Open(text, sourceName, baseDirectory);
        root.AllowOnly(TopKeys);
        var name = root.RequiredString("name", "Give the design a name: name = \"...\" at the top of the file.");
        if (string.IsNullOrWhiteSpace(name))
            throw root.ErrorAtValue("name", "empty name", "Give the design a short name.");
        var sensorSection = root.RequiredSection("sensor", "Add a [sensor] section with model = \"beta\", \"steinhart-hart\", \"table\" or \"rtd\".");
        var sensor = SensorReader.Read(sensorSection);
        var model = Build(sensorSection, sensor);
        return new FrontEndDesign
        {
            Name = name,
            Description = root.String("description"),
            Sensor = sensor,
            Divider = CircuitReaders.ReadDivider(root.RequiredSection("divider", "Add a [divider] section (sensor_side, fixed_resistor, excitation).")),
            Buffer = root.Section("buffer") is { } buffer ? CircuitReaders.ReadBuffer(buffer) : null,
            Filter = root.Section("filter") is { } filter ? CircuitReaders.ReadFilter(filter) : FilterSpec.None,
            Adc = AdcReader.Read(root.RequiredSection("adc", "Add an [adc] section (bits, reference, sample_rate, acquisition_time, ...).")),
            Check = CheckReader.Read(root.RequiredSection("check", "Add a [check] section (range, budget)."), model.ValidRange),
            Tolerances = root.Section("tolerances") is { } tolerances ? ToleranceReader.Read(tolerances) : ToleranceSpec.Default,
        };
    }

    /// <summary>
    /// Builds the sensor model once at load time, so that a table that cannot be used or coefficients that do not
    /// describe an NTC are errors of the design file, with its position, rather than failures later.
    /// </summary>
    private static ISensorModel Build(TomlSection section, SensorSpec sensor)
    {
        try
        {
            return sensor.Build();
        }
        catch (SensorTableException e)
        {
            throw section.ErrorAtValue("file", e.Message.TrimEnd('.'), "Fix the table's rows, or point file at another table.");
        }
        catch (ArgumentException e)
        {
            throw section.ErrorAtValue(sensor is SteinhartHartSensorSpec ? "a" : "model", e.Message.TrimEnd('.'),
                "Check the sensor's parameters against its documentation.");
        }
    }
}
