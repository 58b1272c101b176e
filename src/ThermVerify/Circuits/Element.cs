namespace ThermVerify.Circuits;

/// <summary>
/// A circuit element on named nodes ("0" is ground). Records are immutable; how an element enters the
/// matrix belongs to the engine that runs it (the built-in engine's stamps live in Simulation/Stamps).
/// </summary>
internal abstract record Element(string Name)
{
    /// <summary>Every terminal, in the element's own order (controlling terminals included).</summary>
    public abstract IReadOnlyList<string> Nodes { get; }

    /// <summary>Node pairs joined by a path that conducts at DC (resistive, voltage-defined, shorts).</summary>
    internal virtual IEnumerable<(string A, string B)> DcPaths => [];

    /// <summary>Node pairs whose voltage the element fixes (sources, inductors): a loop of these is singular.</summary>
    internal virtual IEnumerable<(string A, string B)> VoltageDefinedPaths => [];

    /// <summary>DC paths when capacitors with an initial voltage are held at it (transient start).</summary>
    internal virtual IEnumerable<(string A, string B)> DcPathsHoldingInitialConditions => DcPaths;

    /// <summary>Labels of the extra unknowns (branch currents, internal nodes) this element adds.</summary>
    internal virtual IReadOnlyList<ExtraUnknown> ExtraUnknowns => [];

    /// <summary>Checks values; throws <see cref="CircuitException"/> naming the element.</summary>
    internal virtual void Validate() => ElementChecks.Name(this);

    /// <summary>The element's lines in a SPICE deck; elements without a SPICE form say so.</summary>
    internal virtual void WriteSpice(Spice.SpiceLines deck) =>
        throw new EngineUnsupportedException($"{Describe} has no SPICE form; it cannot be written to a deck or run by ngspice.");

    internal string Describe => $"{GetType().Name} '{Name}'";
}
