using ThermVerify.Files;
using ThermVerify.Limits;
using ThermVerify.Provenance;
using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>
/// Loads a design file strictly: unknown keys, missing required keys, wrong units and impossible values
/// are all <see cref="DesignException"/>s with file, line, column and a hint. See docs/design-file.md.
/// </summary>
internal static class DesignLoader
{
    private static readonly string[] TopKeys = ["name", "description", "sensor", "divider", "bridge", "amplifier", "current_source", "wiring", "buffer", "filter", "protection", "adc", "check", "noise", "tolerances", "netlist"];

    public static FrontEndDesign Load(string path)
    {
        var full = Path.GetFullPath(path);
        InputText read;
        try
        {
            read = InputFile.Read(full, Work.Limits.MaximumFileBytes);
        }
        catch (InputFileException e)
        {
            throw new DesignException(path, 1, 1, "", $"cannot read the design file: it {e.Problem}", e.Hint);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new DesignException(path, 1, 1, "", $"cannot read the design file ({e.Message.TrimEnd('.')})", "Check the path and the file's permissions.");
        }
        return Parse(read.Text, path, Path.GetDirectoryName(full) ?? ".", read.Sha256);
    }

    /// <param name="sourceName">Name used in error messages, usually the path as the user gave it.</param>
    /// <param name="baseDirectory">Folder that relative paths in the design are resolved against (and must stay inside).</param>
    /// <param name="sha256">SHA-256 of the design file's bytes as read; of the text's UTF-8 bytes when not given.</param>
    public static FrontEndDesign Parse(string text, string sourceName, string baseDirectory, string? sha256 = null)
    {
        if (text.Length > Work.Limits.MaximumFileBytes)
            throw new DesignException(sourceName, 1, 1, "", $"the design is larger than the limit of {Work.Limits.MaximumFileBytes} bytes",
                "A design file is a few kilobytes; if this one is really meant, raise --max-file-size.");
        var root = TomlSection.Open(text, sourceName, baseDirectory);
        root.AllowOnly(TopKeys);
        var name = root.RequiredString("name", "Give the design a name: name = \"...\" at the top of the file.");
        if (string.IsNullOrWhiteSpace(name))
            throw root.ErrorAtValue("name", "empty name", "Give the design a short name.");
        var sensorSection = root.RequiredSection("sensor", "Add a [sensor] section with model = \"beta\", \"steinhart-hart\", \"table\" or \"rtd\".");
        var sensor = SensorReader.Read(sensorSection);
        var model = Build(sensorSection, sensor);
        ExcitationRules.CheckOneShape(root);
        var bridge = root.Section("bridge") is { } bridgeSection ? BridgeReader.Read(bridgeSection) : default((DividerSpec Half, BridgeSpec Opposite)?);
        var design = new FrontEndDesign
        {
            Name = name,
            Description = root.String("description"),
            Sensor = sensor,
            Divider = root.Section("divider") is { } divider ? CircuitReaders.ReadDivider(divider) : bridge?.Half,
            Bridge = bridge?.Opposite,
            Amplifier = root.Section("amplifier") is { } amplifier ? AmplifierReader.Read(amplifier) : null,
            CurrentSource = root.Section("current_source") is { } source ? CurrentSourceReader.Read(source) : null,
            Netlist = root.Section("netlist") is { } netlist ? NetlistReader.Read(netlist) : null,
            Wiring = root.Section("wiring") is { } wiring ? WiringReader.Read(wiring) : null,
            Buffer = root.Section("buffer") is { } buffer ? CircuitReaders.ReadBuffer(buffer) : null,
            Filter = root.Section("filter") is { } filter ? CircuitReaders.ReadFilter(filter) : FilterSpec.None,
            Protection = root.Section("protection") is { } protection ? ProtectionReader.Read(protection) : null,
            Adc = AdcReader.Read(root.RequiredSection("adc", "Add an [adc] section (bits, reference, sample_rate, acquisition_time, ...).")),
            Check = CheckReader.Read(root.RequiredSection("check", "Add a [check] section (range, budget)."), model.ValidRange),
            Noise = root.Section("noise") is { } noise ? NoiseReader.Read(noise) : NoiseSpec.Default,
            Tolerances = root.Section("tolerances") is { } tolerances ? ToleranceReader.Read(tolerances) : ToleranceSpec.Default,
        };
        var designFile = new SourceFile(Path.GetFileName(sourceName), sha256 ?? DesignDigest.OfText(sourceName, text).Sha256);
        design = design with { Source = new DesignDigest([designFile, .. root.FilesRead]) };
        CheckWork(root.Section("check")!, design.Check);
        ExcitationRules.Check(root, design);
        return design;
    }

    /// <summary>
    /// The sweep's size is known before any work: a step of 1e-12 K over the range would ask for 10^14 temperatures,
    /// which no run can hold, so it is refused here with the limit and the option that raises it.
    /// </summary>
    private static void CheckWork(TomlSection check, CheckSpec spec)
    {
        var limit = Work.Limits.MaximumSweepPoints;
        var points = Math.Floor((spec.Range.MaxCelsius - spec.Range.MinCelsius) / spec.StepKelvin) + 1;
        if (!(points <= limit))
            throw check.ErrorAtValue(check.Has("step") ? "step" : "range",
                $"the sweep would take {points:G3} temperatures, more than the limit of {limit}",
                "Use a coarser step (the check interpolates between points for nothing finer than the ADC resolves), or raise --max-points.");
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
