namespace ThermVerify.Simulation.Mna;

/// <summary>The four matrix slots of a two-terminal conductance between nodes a and b.</summary>
internal readonly struct ConductanceSlots
{
    private readonly int aa, ab, ba, bb;

    public ConductanceSlots(BindContext c, int a, int b)
    {
        aa = c.Slot(a, a);
        ab = c.Slot(a, b);
        ba = c.Slot(b, a);
        bb = c.Slot(b, b);
    }

    public void Add(double[] matrix, double g)
    {
        matrix[aa] += g;
        matrix[ab] -= g;
        matrix[ba] -= g;
        matrix[bb] += g;
    }
}
