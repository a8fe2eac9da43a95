using ScottPlot;

namespace Lightfold.Cli;

/// <summary>Weighted step histograms drawn with ScottPlot (several series on shared bins).</summary>
public static class Histograms
{
    /// <summary>A plot of weighted histograms of each series on the given bin edges (each normalised to unit sum when asked).</summary>
    public static Plot Build(string title, string xLabel, string yLabel, double[] edges, IReadOnlyList<(string Name, double[] Values, double[] Weights)> series,
        bool logX = false, bool normalise = false)
    {
        var plot = new Plot();
        var palette = new ScottPlot.Palettes.Category10();
        for (int s = 0; s < series.Count; s++)
        {
            var (name, values, weights) = series[s];
            var heights = new double[edges.Length - 1];
            for (int i = 0; i < values.Length; i++)
            {
                double v = logX ? Math.Log10(values[i]) : values[i];
                if (!double.IsFinite(v)) continue;
                int k = Array.BinarySearch(edges, v);
                if (k < 0) k = ~k - 1;
                if (k >= 0 && k < heights.Length) heights[k] += weights[i];
            }
            double total = heights.Sum();
            if (normalise && total > 0) for (int k = 0; k < heights.Length; k++) heights[k] /= total;
            // Step outline: x at edges, y repeated.
            var xs = new List<double>();
            var ys = new List<double>();
            for (int k = 0; k < heights.Length; k++)
            {
                xs.Add(edges[k]); ys.Add(heights[k]);
                xs.Add(edges[k + 1]); ys.Add(heights[k]);
            }
            var line = plot.Add.Scatter(xs.ToArray(), ys.ToArray());
            line.MarkerSize = 0;
            line.LineWidth = 2;
            line.Color = palette.GetColor(s);
            line.LegendText = name;
        }
        plot.Title(title);
        plot.XLabel(logX ? $"log10 {xLabel}" : xLabel);
        plot.YLabel(yLabel);
        plot.ShowLegend(Alignment.UpperRight);
        return plot;
    }

    /// <summary>Evenly spaced bin edges.</summary>
    public static double[] Edges(double lo, double hi, int bins) => Enumerable.Range(0, bins + 1).Select(i => lo + (hi - lo) * i / bins).ToArray();
}
