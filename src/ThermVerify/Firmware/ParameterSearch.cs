namespace ThermVerify.Firmware;

/// <summary>
/// One-parameter minimisation on a log scale: a grid finds the basin (the cost need not be unimodal over the whole
/// interval), then golden-section search refines inside the grid cell pair around the best point.
/// </summary>
internal static class ParameterSearch
{
    public static double Minimise(Func<double, double> cost, double lo, double hi, int gridPoints = 121)
    {
        var (a, b) = (Math.Log(lo), Math.Log(hi));
        var step = (b - a) / (gridPoints - 1);
        var best = 0;
        var bestCost = double.PositiveInfinity;
        for (var i = 0; i < gridPoints; i++)
        {
            var c = cost(Math.Exp(a + i * step));
            if (c < bestCost) (best, bestCost) = (i, c);
        }
        var (x0, x1) = (a + Math.Max(0, best - 1) * step, a + Math.Min(gridPoints - 1, best + 1) * step);
        var ratio = (Math.Sqrt(5) - 1) / 2;
        var (u, v) = (x1 - ratio * (x1 - x0), x0 + ratio * (x1 - x0));
        var (fu, fv) = (cost(Math.Exp(u)), cost(Math.Exp(v)));
        for (var i = 0; i < 80 && x1 - x0 > 1e-12; i++)
        {
            if (fu <= fv) { x1 = v; (v, fv) = (u, fu); u = x1 - ratio * (x1 - x0); fu = cost(Math.Exp(u)); }
            else { x0 = u; (u, fu) = (v, fv); v = x0 + ratio * (x1 - x0); fv = cost(Math.Exp(v)); }
        }
        var x = fu <= fv ? u : v;
        return Math.Min(fu, fv) <= bestCost ? Math.Exp(x) : Math.Exp(a + best * step);
    }
}
