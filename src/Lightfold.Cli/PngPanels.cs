using Lightfold.Catalog;
using ScottPlot;
using SkiaSharp;

namespace Lightfold.Cli;

/// <summary>Saves one or more ScottPlot panels stacked vertically into one PNG, atomically.</summary>
public static class PngPanels
{
    /// <summary>Renders each plot at width × panelHeight and stacks them.</summary>
    public static void Save(string path, IReadOnlyList<Plot> panels, int width = 1000, int panelHeight = 360)
    {
        string full = Path.GetFullPath(path);
        string? folder = Path.GetDirectoryName(full);
        if (folder is not null && !Directory.Exists(folder)) throw new InputException($"cannot write '{path}': folder '{folder}' does not exist");
        using var bitmap = new SKBitmap(width, panelHeight * panels.Count);
        using (var canvas = new SKCanvas(bitmap))
        {
            canvas.Clear(SKColors.White);
            for (int i = 0; i < panels.Count; i++)
            {
                byte[] png = panels[i].GetImageBytes(width, panelHeight, ImageFormat.Png);
                using var panel = SKBitmap.Decode(png);
                canvas.DrawBitmap(panel, 0, i * panelHeight);
            }
        }
        string temp = AtomicFile.TempName(full);
        try
        {
            using (var data = bitmap.Encode(SKEncodedImageFormat.Png, 100))
            using (var stream = File.Create(temp))
                data.SaveTo(stream);
            AtomicFile.Commit(temp, full);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            AtomicFile.TryDelete(temp);
            throw new InputException($"cannot write '{path}': {e.Message}");
        }
    }
}
