# KLayout batch script for the geometry benchmark (`klayout -b -r klayout-dxf.py -rd input=F.dxf -rd output=G`):
# reads one of our mask DXFs (1 DXF unit = 1 µm, database unit 1 nm), fills every layer even-odd (XOR of its rings)
# and writes "layer area_um2 polygons" per layer, so the benchmark can check KLayout's merge of the file
# against our merged areas.
import pya  # noqa: F401 (provided by klayout -b)

opts = pya.LoadLayoutOptions()
opts.dxf_unit = 1.0
opts.dxf_dbu = 0.001
layout = pya.Layout()
layout.read(input, opts)  # noqa: F821 (set by -rd)
top = layout.top_cell()
with open(output, "w", encoding="utf-8") as out:  # noqa: F821 (set by -rd)
    for li in layout.layer_indexes():
        info = layout.get_info(li)
        # Holes are their own closed polylines in our DXF: a plotter fills even-odd, so XOR the rings in turn.
        region = pya.Region()
        it = top.begin_shapes_rec(li)
        while not it.at_end():
            shape = it.shape()
            if shape.is_polygon() or shape.is_path() or shape.is_box():
                region = region ^ pya.Region(shape.polygon.transformed(it.trans()))
            it.next()
        out.write("%s %.6f %d\n" % (info.name or str(info.layer), region.area() * layout.dbu * layout.dbu, region.count()))
